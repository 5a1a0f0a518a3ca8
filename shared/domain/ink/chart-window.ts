import type { ChartForm } from '../chart-form';
import { readingToPixel, type RegistrationFit } from '../registration';

/**
 * The pixels where ink can be for a span of time: a column range, and for every column the rows between the
 * top and bottom of the printed range (plus a margin for a pen riding just past the edge).
 */
export interface ChartWindow {
  /** First column (inclusive) and last column (exclusive). */
  x0: number;
  x1: number;
  /** Per column (index x − x0): first row and last row (exclusive), clamped to the image. */
  rowTop: Int32Array;
  rowBottom: Int32Array;
  /** Pixels per mm of paper, along the pressure direction (for widths and margins). */
  pxPerMm: number;
}

function lineY(a: { xPx: number; yPx: number }, b: { xPx: number; yPx: number }, x: number): number {
  const dx = b.xPx - a.xPx;
  return Math.abs(dx) < 1e-9 ? a.yPx : a.yPx + ((x - a.xPx) * (b.yPx - a.yPx)) / dx;
}

/** Window for hours [startHours, endHours] after the chart start; margin in paper mm beyond the printed range. */
export function chartWindow(
  form: ChartForm,
  fit: RegistrationFit,
  size: { width: number; height: number },
  startHours: number,
  endHours: number,
  marginMm = 1,
): ChartWindow {
  const corners = [form.pressureMin, form.pressureMax, (form.pressureMin + form.pressureMax) / 2].flatMap((pressure) => [
    readingToPixel(form, fit, { hours: startHours, pressure }),
    readingToPixel(form, fit, { hours: endHours, pressure }),
  ]);
  const xs = corners.map((c) => c.xPx);
  const x0 = Math.max(0, Math.floor(Math.min(...xs)));
  const x1 = Math.min(size.width, Math.ceil(Math.max(...xs)) + 1);
  // A pressure line is straight on the scan (the registration is a plane transform), so two points define it.
  const topA = readingToPixel(form, fit, { hours: 0, pressure: form.pressureMax });
  const topB = readingToPixel(form, fit, { hours: form.drumHours, pressure: form.pressureMax });
  const bottomA = readingToPixel(form, fit, { hours: 0, pressure: form.pressureMin });
  const bottomB = readingToPixel(form, fit, { hours: form.drumHours, pressure: form.pressureMin });
  const heightPx = Math.hypot(bottomA.xPx - topA.xPx, bottomA.yPx - topA.yPx);
  const pxPerMm = heightPx / ((form.pressureMax - form.pressureMin) * form.mmPerUnit);
  const marginPx = marginMm * pxPerMm;
  const count = Math.max(0, x1 - x0);
  const rowTop = new Int32Array(count);
  const rowBottom = new Int32Array(count);
  for (let i = 0; i < count; i++) {
    const x = x0 + i + 0.5;
    const yTop = lineY(topA, topB, x);
    const yBottom = lineY(bottomA, bottomB, x);
    const low = Math.min(yTop, yBottom) - marginPx;
    const high = Math.max(yTop, yBottom) + marginPx;
    rowTop[i] = Math.max(0, Math.floor(low));
    rowBottom[i] = Math.min(size.height, Math.ceil(high));
  }
  return { x0, x1, rowTop, rowBottom, pxPerMm };
}
