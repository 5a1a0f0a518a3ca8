import type { ChartForm } from './chart-form';
import { chartGrid } from './chart-grid';
import { applyHomography } from './homography';
import type { RegistrationFit } from './registration';

/** A point on the scan, px (x right, y down). */
export interface ScanPoint {
  xPx: number;
  yPx: number;
}

/** One printed grid line as the fit puts it on the scan: a time arc (sampled) or a pressure line (its two ends). */
export interface GhostGridLine {
  kind: 'time' | 'pressure';
  /** Hours after the chart-start line (time) or pressure in the form's unit (pressure). */
  value: number;
  isLabelled: boolean;
  points: ScanPoint[];
}

/**
 * The ghost grid: the chart form's printed grid carried onto the scan by a fitted registration, arcs
 * included. It is drawn over the scan so that a bad pin or a wrong chart form shows as printed lines that
 * the ghost lines miss. The arcs use the fit's radius (fitted when the form gives none), as the reading does.
 */
export function ghostGrid(form: ChartForm, fit: Pick<RegistrationFit, 'paperToPixel' | 'penArmRadiusMm'>): GhostGridLine[] {
  const grid = chartGrid({ ...form, penArmRadiusMm: fit.penArmRadiusMm });
  const toScan = (uMm: number, vMm: number): ScanPoint => {
    const pixel = applyHomography(fit.paperToPixel, { x: uMm, y: vMm });
    return { xPx: pixel.x, yPx: pixel.y };
  };
  const arcs = grid.timeArcs.map(
    (arc): GhostGridLine => ({ kind: 'time', value: arc.hours, isLabelled: arc.isLabelled, points: arc.points.map((p) => toScan(p.uMm, p.vMm)) }),
  );
  // Pressure lines are straight on paper and a homography keeps lines straight: the two ends are enough.
  const lines = grid.pressureLines.map(
    (line): GhostGridLine => ({
      kind: 'pressure',
      value: line.pressure,
      isLabelled: line.isLabelled,
      points: [toScan(line.fromUMm, line.vMm), toScan(line.toUMm, line.vMm)],
    }),
  );
  return [...lines, ...arcs];
}
