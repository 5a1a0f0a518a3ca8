import type { ChartForm } from './chart-form';
import { toHpa } from './pressure-units';

/** The largest registration RMS a hand-in may have on a chart form: along pressure (hPa) and along time (minutes). */
export interface PinRmsLimit {
  hPa: number;
  minutes: number;
}

/**
 * Half a printed grid step each way: a pin whose reading is off by more than half a step has most likely been
 * typed for the neighbouring grid line, and the registration built on it reads every knot wrong (common practice).
 * The limit follows the form's own grid, so it is set per chart form.
 */
export function pinRmsLimit(form: ChartForm): PinRmsLimit {
  return {
    hPa: Math.abs(toHpa(form.pressureMin + form.gridPressureStep, form.pressureUnit) - toHpa(form.pressureMin, form.pressureUnit)) / 2,
    minutes: (form.gridHoursStep * 60) / 2,
  };
}
