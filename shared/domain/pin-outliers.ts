import type { ChartForm } from './chart-form';
import { readingFromPaper } from './chart-geometry';
import { applyHomography, invert3x3 } from './homography';
import { fitTransform, MIN_PINS, PARAMETER_COUNT, paperPoints, type PinLike, pixelPoints, type RegistrationModel } from './registration-model';

/** Thresholds of findOutlierPins: a pin is flagged when left out it misses by > max(minMm, k·σ of the rest). */
export interface OutlierOptions {
  /** Multiple of the other pins’ residual spread (default 6). */
  k?: number;
  /** Paper distance never flagged, mm (default 0.5: about the width of a pen line). */
  minMm?: number;
}

/**
 * Indices of pins far beyond the others, by backward search: leave out the pin whose removal most lowers the
 * other pins' misfit; flag it when the grid fitted to the rest misses it by more than max(minMm, k·σ_rest), and
 * repeat on the rest. Least squares spreads a bad pin's error over good ones, so residuals of the full fit hide
 * it; the refit does not. σ_rest = √(Σd²/(2m − p)) over the m remaining pins' paper distances d (mm).
 */
export function findOutlierPins(form: ChartForm, model: RegistrationModel, radiusMm: number | null, pins: PinLike[], options: OutlierOptions = {}): Set<number> {
  const k = options.k ?? 6;
  const minMm = options.minMm ?? 0.5;
  const flagged = new Set<number>();
  let active = pins.map((_, i) => i);
  // The rest must hold twice the equations the model needs, or σ_rest is too optimistic and a left-out pin of
  // high leverage looks bad (seen with 6-pin projective fits); never flag more than a third of the pins.
  const minSpare = Math.max(4, PARAMETER_COUNT[model]);
  while (2 * (active.length - 1) - PARAMETER_COUNT[model] >= minSpare && active.length - 1 >= MIN_PINS[model] && flagged.size < Math.floor(pins.length / 3)) {
    let best: { index: number; rest: number[]; sumSquaredMm: number; matrix: number[] } | null = null;
    for (const candidate of active) {
      const rest = active.filter((i) => i !== candidate);
      const restPins = rest.map((i) => pins[i]);
      const matrix = fitTransform(form, model, paperPoints(form, restPins, radiusMm), pixelPoints(restPins));
      if (matrix === null) continue;
      const sumSquaredMm = restPins.reduce((s, p) => s + distanceMm(form, matrix, radiusMm, p) ** 2, 0);
      if (best === null || sumSquaredMm < best.sumSquaredMm) best = { index: candidate, rest, sumSquaredMm, matrix };
    }
    if (best === null) break;
    const sigmaMm = Math.sqrt(best.sumSquaredMm / (2 * best.rest.length - PARAMETER_COUNT[model]));
    const missMm = distanceMm(form, best.matrix, radiusMm, pins[best.index]);
    if (!(missMm > Math.max(minMm, k * sigmaMm))) break;
    flagged.add(best.index);
    active = best.rest;
  }
  return flagged;
}

/** Paper distance (mm) between a pin's typed reading and the reading the transform gives at its pixel. */
function distanceMm(form: ChartForm, paperToPixel: number[], radiusMm: number | null, pin: PinLike): number {
  const pixelToPaper = invert3x3(paperToPixel);
  if (pixelToPaper === null) return Number.POSITIVE_INFINITY;
  const paper = applyHomography(pixelToPaper, { x: pin.xPx, y: pin.yPx });
  const reading = readingFromPaper(form, { uMm: paper.x, vMm: paper.y }, radiusMm);
  const distance = Math.hypot((reading.hours - pin.hours) * form.mmPerHour, (reading.pressure - pin.pressure) * form.mmPerUnit);
  return Number.isFinite(distance) ? distance : Number.POSITIVE_INFINITY;
}
