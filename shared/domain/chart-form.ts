import type { PressureUnit } from './pressure-units';

/**
 * A printed chart type: the geometry the chart model needs to turn paper positions into time and pressure.
 * Paper coordinates are millimetres: u along the time direction (0 at the chart-start time line, measured
 * at the arm pivot's level), v along the pressure direction (0 on the pressureMin line, growing upward).
 */
export interface ChartForm {
  name: string;
  /** Unit the chart is printed in. */
  pressureUnit: PressureUnit;
  /** Lowest and highest printed pressure lines, in pressureUnit. */
  pressureMin: number;
  pressureMax: number;
  /** Hours the drum takes for one turn: 168 for a weekly chart, 24–26 for a daily one. */
  drumHours: number;
  /** Paper scale along the time direction, mm per hour. */
  mmPerHour: number;
  /** Paper scale along the pressure direction, mm per one pressureUnit. */
  mmPerUnit: number;
  /** Pen-arm length in mm; the printed time lines are arcs of this radius. Null: straight time lines. */
  penArmRadiusMm: number | null;
  /**
   * Pressure (in pressureUnit) at the level of the arm's pivot, where a time arc meets its nominal time.
   * Null means the middle of the range.
   */
  pivotPressure: number | null;
  /** Which way the arcs bow: +1 when points away from the pivot level sit later in u, −1 earlier. */
  arcSide: 1 | -1;
  /** Spacing of printed grid lines and of their labels. */
  gridPressureStep: number;
  labelPressureStep: number;
  gridHoursStep: number;
  labelHoursStep: number;
}

/** Height of the printed pressure range on paper, mm. */
export function chartHeightMm(form: ChartForm): number {
  return (form.pressureMax - form.pressureMin) * form.mmPerUnit;
}

/** Length of one drum turn on paper, mm. */
export function chartLengthMm(form: ChartForm): number {
  return form.drumHours * form.mmPerHour;
}

/** v (mm) of the pivot level. */
export function pivotLevelMm(form: ChartForm): number {
  const p = form.pivotPressure ?? (form.pressureMin + form.pressureMax) / 2;
  return (p - form.pressureMin) * form.mmPerUnit;
}

/**
 * Lists the problems of a chart form (empty when it is usable), with the field each one concerns.
 * A pen-arm radius below half the chart height cannot draw the printed arcs at all.
 */
export function checkChartForm(form: ChartForm): Record<string, string> {
  const problems: Record<string, string> = {};
  if (!(form.pressureMax > form.pressureMin)) problems['pressureMax'] = 'pressureMax must be above pressureMin';
  if (!(form.drumHours > 0)) problems['drumHours'] = 'drumHours must be positive';
  if (!(form.mmPerHour > 0)) problems['mmPerHour'] = 'mmPerHour must be positive';
  if (!(form.mmPerUnit > 0)) problems['mmPerUnit'] = 'mmPerUnit must be positive';
  if (form.penArmRadiusMm !== null) {
    if (!(form.penArmRadiusMm > 0)) problems['penArmRadiusMm'] = 'penArmRadiusMm must be positive or null';
    else if (form.pressureMax > form.pressureMin && form.mmPerUnit > 0) {
      const half = chartHeightMm(form) / 2;
      if (form.penArmRadiusMm < half) {
        problems['penArmRadiusMm'] = `pen-arm radius ${form.penArmRadiusMm} mm is smaller than half the chart height (${half.toFixed(1)} mm)`;
      }
    }
  }
  if (!(form.gridPressureStep > 0)) problems['gridPressureStep'] = 'gridPressureStep must be positive';
  if (!(form.gridHoursStep > 0)) problems['gridHoursStep'] = 'gridHoursStep must be positive';
  return problems;
}
