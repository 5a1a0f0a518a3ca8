import type { ChartForm } from '../chart-form';
import { readingToPixel, type RegistrationFit } from '../registration';

/**
 * Where ink can be for a span of time, in "time columns": column i is the printed time arc through pixel
 * (x0 + i + 0.5, pivot row). On image row y that arc sits rowShift[y] pixels right of its pivot-level foot, so
 * the pen line, which moves along the arc whenever pressure changes, is a function of the column even where it
 * bends back across pixel columns (a fast rise far from the pivot level).
 */
export interface ChartWindow {
  /** First column (inclusive) and last column (exclusive), as pixel x at the pivot row. */
  x0: number;
  x1: number;
  /** Per column (index i): first row and last row (exclusive), clamped to the image. */
  rowTop: Int32Array;
  rowBottom: Int32Array;
  /** Per image row: horizontal offset (px) of a time arc on that row from its foot at the pivot row. */
  rowShift: Float32Array;
  /** Pixels per mm of paper, along the pressure direction (for widths and margins). */
  pxPerMm: number;
}

/** Pixel x on row y of time column i (continuous coordinates, column centre). */
export function columnX(window: ChartWindow, i: number, y: number): number {
  const row = Math.min(window.rowShift.length - 1, Math.max(0, Math.floor(y)));
  return window.x0 + i + 0.5 + window.rowShift[row];
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
  const pivotPressure = form.pivotPressure ?? (form.pressureMin + form.pressureMax) / 2;
  const midHours = (startHours + endHours) / 2;
  const foot = readingToPixel(form, fit, { hours: midHours, pressure: pivotPressure });
  const above = readingToPixel(form, fit, { hours: midHours, pressure: pivotPressure + 1 });
  const rowsPerUnit = above.yPx - foot.yPx;
  const pxPerMm = Math.hypot(above.xPx - foot.xPx, above.yPx - foot.yPx) / form.mmPerUnit;

  // Each row's shift along the middle arc; Newton steps on the arc's y find the pressure of the row.
  const rowShift = new Float32Array(size.height);
  for (let y = 0; y < size.height; y++) {
    let pressure = pivotPressure + (y + 0.5 - foot.yPx) / rowsPerUnit;
    let point = readingToPixel(form, fit, { hours: midHours, pressure });
    for (let step = 0; step < 2; step++) {
      pressure += (y + 0.5 - point.yPx) / rowsPerUnit;
      point = readingToPixel(form, fit, { hours: midHours, pressure });
    }
    rowShift[y] = point.xPx - foot.xPx;
  }

  const start = readingToPixel(form, fit, { hours: startHours, pressure: pivotPressure });
  const end = readingToPixel(form, fit, { hours: endHours, pressure: pivotPressure });
  const x0 = Math.max(0, Math.floor(Math.min(start.xPx, end.xPx)));
  const x1 = Math.min(size.width, Math.ceil(Math.max(start.xPx, end.xPx)) + 1);
  const count = Math.max(0, x1 - x0);
  const rowTop = new Int32Array(count);
  const rowBottom = new Int32Array(count);
  const marginPx = marginMm * pxPerMm;
  // Top and bottom of the printed range along each column's arc, from its two ends (start and end hours).
  const topStart = readingToPixel(form, fit, { hours: startHours, pressure: form.pressureMax }).yPx;
  const topEnd = readingToPixel(form, fit, { hours: endHours, pressure: form.pressureMax }).yPx;
  const bottomStart = readingToPixel(form, fit, { hours: startHours, pressure: form.pressureMin }).yPx;
  const bottomEnd = readingToPixel(form, fit, { hours: endHours, pressure: form.pressureMin }).yPx;
  for (let i = 0; i < count; i++) {
    const f = count > 1 ? i / (count - 1) : 0;
    const yTop = topStart + f * (topEnd - topStart);
    const yBottom = bottomStart + f * (bottomEnd - bottomStart);
    rowTop[i] = Math.max(0, Math.floor(Math.min(yTop, yBottom) - marginPx));
    rowBottom[i] = Math.min(size.height, Math.ceil(Math.max(yTop, yBottom) + marginPx));
  }
  return { x0, x1, rowTop, rowBottom, rowShift, pxPerMm };
}
