import { type ChartForm, pivotLevelMm } from './chart-form';

/** A position on the paper, mm (see ChartForm for the axes). */
export interface PaperPoint {
  uMm: number;
  vMm: number;
}

/** A reading of the chart: hours after the chart-start line and pressure in the form's unit. */
export interface ChartReading {
  hours: number;
  pressure: number;
}

/**
 * How far (mm, along u) a time arc of radius R sits from its foot at height v.
 * The pen tip swings on a circle of radius R about the pivot, so a line of constant time is that circle:
 * u = u0 + s·(R − √(R² − (v − vc)²)). Straight time lines (R = null) give 0.
 */
export function arcOffsetMm(form: ChartForm, vMm: number, radiusMm: number | null = form.penArmRadiusMm): number {
  if (radiusMm === null) return 0;
  const dv = vMm - pivotLevelMm(form);
  const inside = radiusMm * radiusMm - dv * dv;
  // Beyond the arm's reach the arc does not exist; clamp so that callers get the extreme of the arc.
  const root = inside > 0 ? Math.sqrt(inside) : 0;
  return form.arcSide * (radiusMm - root);
}

/** Chart reading → paper position. */
export function paperFromReading(form: ChartForm, reading: ChartReading, radiusMm: number | null = form.penArmRadiusMm): PaperPoint {
  const vMm = (reading.pressure - form.pressureMin) * form.mmPerUnit;
  const uMm = reading.hours * form.mmPerHour + arcOffsetMm(form, vMm, radiusMm);
  return { uMm, vMm };
}

/** Paper position → chart reading, reading time along the arc through the point. */
export function readingFromPaper(form: ChartForm, point: PaperPoint, radiusMm: number | null = form.penArmRadiusMm): ChartReading {
  const pressure = form.pressureMin + point.vMm / form.mmPerUnit;
  const u0 = point.uMm - arcOffsetMm(form, point.vMm, radiusMm);
  return { hours: u0 / form.mmPerHour, pressure };
}
