import type { ChartForm } from './chart-form';
import { toHpa } from './pressure-units';
import type { RegularPoint } from './resample';

/**
 * The independent error sources of one series point, each a standard uncertainty (1σ):
 * pressure parts in hPa, time parts in minutes.
 */
export interface UncertaintyBudget {
  /** Registration RMS along pressure (RegistrationFit.rmsHpa). */
  registrationRmsHpa: number;
  /** Registration RMS along time (RegistrationFit.rmsMinutes). */
  registrationRmsMinutes: number;
  /** Line-width centring error (lineCentringUncertaintyHpa). */
  lineCentringHpa: number;
  /** Instrument correction residual RMS (InstrumentCorrection.rmsHpa). */
  instrumentRmsHpa: number;
  /** Clock correction residual RMS (ClockCorrection.rmsMinutes). */
  clockRmsMinutes: number;
}

/**
 * Root-sum-square of the budget, hPa ≥ 0: u = √(u_reg² + u_line² + u_instr² + (|dp/dt| · √(t_reg² + t_clock²))²).
 * Time errors become pressure errors through the local slope dp/dt (hPa per hour, any sign); the sources are
 * taken as independent, so their variances add (GUM, JCGM 100:2008 §5.1, from memory).
 */
export function combineUncertaintyHpa(budget: UncertaintyBudget, slopeHpaPerHour: number): number {
  const timeHours = Math.hypot(budget.registrationRmsMinutes, budget.clockRmsMinutes) / 60;
  return Math.hypot(budget.registrationRmsHpa, budget.lineCentringHpa, budget.instrumentRmsHpa, slopeHpaPerHour * timeHours);
}

/**
 * Centring error of a pen line lineWidthMm wide (> 0), hPa: the traced centre lies anywhere within ±w/2, a
 * rectangular distribution with standard uncertainty (w/2)/√3 (GUM, JCGM 100:2008 §4.3.7, from memory).
 */
export function lineCentringUncertaintyHpa(form: ChartForm, lineWidthMm: number): number {
  return toHpa(lineWidthMm / 2 / Math.sqrt(3) / form.mmPerUnit, form.pressureUnit);
}

/**
 * Sets each valued point's uncertainty (hPa) from the budget and the slope between its valued neighbours,
 * combined by root-sum-square with any uncertainty already on the point. Gaps and off-scale points keep null.
 */
export function applyUncertainty(points: RegularPoint[], budget: UncertaintyBudget): RegularPoint[] {
  return points.map((point, i) => {
    if (point.pressureHpa === null || point.flag === 'gap' || point.flag === 'off_scale') return point;
    const slope = slopeAt(points, i);
    const combined = combineUncertaintyHpa(budget, slope);
    return { ...point, uncertaintyHpa: point.uncertaintyHpa === null ? combined : Math.hypot(point.uncertaintyHpa, combined) };
  });
}

/** Central (or one-sided at the ends and gaps) difference, hPa per hour; 0 when the point stands alone. */
function slopeAt(points: RegularPoint[], i: number): number {
  const hasValue = (j: number) => j >= 0 && j < points.length && points[j].pressureHpa !== null && points[j].flag !== 'gap';
  const left = hasValue(i - 1) ? i - 1 : i;
  const right = hasValue(i + 1) ? i + 1 : i;
  if (left === right) return 0;
  const hours = (points[right].timeMs - points[left].timeMs) / 3_600_000;
  return ((points[right].pressureHpa as number) - (points[left].pressureHpa as number)) / hours;
}
