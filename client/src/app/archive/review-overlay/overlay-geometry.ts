import type { KnotInput, PinInput, PinResidualView } from '@shared/api/ink-lines';
import type { ChartForm } from '@shared/domain/chart-form';
import { ghostGrid, type ScanPoint } from '@shared/domain/ghost-grid';
import type { RegistrationFit } from '@shared/domain/registration';

/** What the review overlay draws over a scan, all in scan pixels. */
export interface OverlayInput {
  widthPx: number;
  heightPx: number;
  /** Null when the scan has no chart form: then there is no ghost grid to draw. */
  chartForm: ChartForm | null;
  registration: Pick<RegistrationFit, 'paperToPixel' | 'penArmRadiusMm'>;
  pins: PinInput[];
  residuals: PinResidualView[];
  /** A pin whose residual is beyond these is marked (the chart form's registration limits). */
  limit: { hPa: number; minutes: number };
  knots: KnotInput[];
  crossKnots: KnotInput[] | null;
}

/** One pin with its residual in words and where the words go. */
export interface OverlayPin {
  xPx: number;
  yPx: number;
  label: string;
  isOverLimit: boolean;
  labelXPx: number;
  labelYPx: number;
  /** SVG text-anchor: labels near the right edge run leftward so they stay on the scan. */
  anchor: 'start' | 'end';
}

export interface OverlayGeometry {
  /** SVG path data of the ghost grid: unlabelled lines, and labelled (printed heavier) ones. */
  gridMinorPath: string;
  gridMajorPath: string;
  inkPoints: string;
  crossPoints: string;
  pins: OverlayPin[];
  /** Line width and label size, scan px: about the same on screen whatever the scan's resolution. */
  strokePx: number;
  fontPx: number;
}

const fmt = (n: number) => (Math.round(n * 10) / 10).toString();
/** A residual with its sign, as it will read once rounded (so a tiny negative one reads 0.0, not −0.0). */
function signed(n: number, digits: number): string {
  const text = Math.abs(n).toFixed(digits);
  const isZero = Number(text) === 0;
  return `${isZero ? '' : n > 0 ? '+' : '−'}${text}`;
}

function pathOf(points: ScanPoint[]): string {
  return points.map((p, i) => `${i === 0 ? 'M' : 'L'}${fmt(p.xPx)} ${fmt(p.yPx)}`).join('');
}

function polylineOf(knots: KnotInput[]): string {
  return knots.map((knot) => `${fmt(knot.xPx)},${fmt(knot.yPx)}`).join(' ');
}

/**
 * The review overlay's geometry: the ghost grid (the form's printed grid placed by the line's own pin fit,
 * arcs included), the ink line and the cross-trace as polylines, and each pin with its residual in hPa and
 * minutes. Pure, so the drawing can be checked without a browser.
 */
export function overlayGeometry(input: OverlayInput): OverlayGeometry {
  // The scan is shown about 800–1000 screen px wide: these keep lines and words readable at that size.
  const strokePx = Math.max(1.5, input.widthPx / 900);
  const fontPx = Math.max(10, input.widthPx / 70);
  const minor: string[] = [];
  const major: string[] = [];
  if (input.chartForm) {
    for (const line of ghostGrid(input.chartForm, input.registration)) (line.isLabelled ? major : minor).push(pathOf(line.points));
  }
  const residualOf = new Map(input.residuals.map((residual) => [residual.index, residual]));
  const pins = input.pins.map((pin, index): OverlayPin => {
    const residual = residualOf.get(index);
    const isOverLimit = residual !== undefined && (Math.abs(residual.pressureHpa) > input.limit.hPa || Math.abs(residual.minutes) > input.limit.minutes);
    const isNearRight = pin.xPx > input.widthPx * 0.75;
    const gap = strokePx * 8;
    return {
      xPx: pin.xPx,
      yPx: pin.yPx,
      label: residual ? `${index + 1}: ${signed(residual.pressureHpa, 2)} hPa, ${signed(residual.minutes, 1)} min` : `${index + 1}`,
      isOverLimit,
      labelXPx: pin.xPx + (isNearRight ? -gap : gap),
      // Below the pin unless that would leave the scan.
      labelYPx: pin.yPx + fontPx * 1.6 > input.heightPx ? pin.yPx - gap : pin.yPx + fontPx * 1.2,
      anchor: isNearRight ? 'end' : 'start',
    };
  });
  return {
    gridMinorPath: minor.join(''),
    gridMajorPath: major.join(''),
    inkPoints: polylineOf(input.knots),
    crossPoints: input.crossKnots ? polylineOf(input.crossKnots) : '',
    pins,
    strokePx,
    fontPx,
  };
}
