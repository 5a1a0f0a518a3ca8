import type { ChartForm } from './chart-form';
import { chartLengthMm, chartHeightMm } from './chart-form';
import { paperFromReading } from './chart-geometry';
import { fitAffine, fitProjective, fitSimilarity, type PlanePoint } from './homography';

/** Paper → pixel transform family: similarity (4 parameters), affine (6) or projective (8). */
export type RegistrationModel = 'similarity' | 'affine' | 'projective';

/** Fewest pins each model accepts. */
export const MIN_PINS: Readonly<Record<RegistrationModel, number>> = { similarity: 3, affine: 3, projective: 4 };
/** Fewest pins any registration accepts: what a draft or a Follow ink request must carry. */
export const FEWEST_PINS = Math.min(...Object.values(MIN_PINS));
/** Free parameters of each model. */
export const PARAMETER_COUNT: Readonly<Record<RegistrationModel, number>> = { similarity: 4, affine: 6, projective: 8 };

/** A reading-bearing pin as the fitting code needs it (pixel x right, y down; hours; pressure in the form's unit). */
export interface PinLike {
  xPx: number;
  yPx: number;
  hours: number;
  pressure: number;
}

/** Paper positions (mm) of the pins' readings on arcs of the given radius (null: straight lines). */
export function paperPoints(form: ChartForm, pins: PinLike[], radiusMm: number | null): PlanePoint[] {
  return pins.map((p) => {
    const paper = paperFromReading(form, p, radiusMm);
    return { x: paper.uMm, y: paper.vMm };
  });
}

/** Pixel positions of the pins. */
export function pixelPoints(pins: PinLike[]): PlanePoint[] {
  return pins.map((p) => ({ x: p.xPx, y: p.yPx }));
}

/**
 * Fits the model from paper to pixels; null when the points do not fix it, or (projective) when the fit would
 * fold the chart: its line at infinity may not come near the sheet, a plausible scan of flat paper never does.
 */
export function fitTransform(form: ChartForm, model: RegistrationModel, paper: PlanePoint[], pixels: PlanePoint[]): number[] | null {
  if (model === 'similarity') return fitSimilarity(paper, pixels);
  if (model === 'affine') return fitAffine(paper, pixels);
  const matrix = fitProjective(paper, pixels);
  return matrix !== null && isPlausibleProjective(form, matrix) ? matrix : null;
}

/**
 * True when the homogeneous scale w = h31·u + h32·v + h33 keeps one sign and varies by less than a factor 1.5
 * over the sheet (with a 20 % margin). Perspective from a flatbed or a camera held square is far smaller.
 */
export function isPlausibleProjective(form: ChartForm, matrix: readonly number[]): boolean {
  const length = chartLengthMm(form);
  const height = chartHeightMm(form);
  const corners = [
    [-0.2 * length, -0.2 * height],
    [1.2 * length, -0.2 * height],
    [-0.2 * length, 1.2 * height],
    [1.2 * length, 1.2 * height],
  ];
  const ws = corners.map(([u, v]) => matrix[6] * u + matrix[7] * v + matrix[8]);
  const isSameSign = ws.every((w) => w > 0) || ws.every((w) => w < 0);
  const magnitudes = ws.map(Math.abs);
  return isSameSign && Math.max(...magnitudes) / Math.min(...magnitudes) < 1.5;
}
