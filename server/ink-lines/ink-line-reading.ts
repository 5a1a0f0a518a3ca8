import type { InkLineDraft } from '@shared/api/ink-lines';
import type { ChartForm } from '@shared/domain/chart-form';
import { applyUncertainty, lineCentringUncertaintyHpa, type UncertaintyBudget } from '@shared/domain/point-uncertainty';
import { fitRegistration, pixelToReading, type RegistrationFit, type RegistrationPin } from '@shared/domain/registration';
import { toHpa } from '@shared/domain/pressure-units';
import { resampleRegular, type TimedPressure } from '@shared/domain/resample';
import type { NewSeriesPoint } from '../series/series.repository';

const MS_PER_HOUR = 3_600_000;
/** Hourly points; a span of more than three hours without knots is a gap (common practice for hourly series). */
const SERIES_STEP_MINUTES = 60;
const SERIES_MAX_GAP_MINUTES = 180;
/** Width of a barograph pen line on paper, mm (common practice: about 0.4 mm). */
export const PEN_LINE_WIDTH_MM = 0.4;

/** Pins as the fit wants them: hours after the chart's chart start instead of ISO times. */
export function toRegistrationPins(draft: InkLineDraft, chartStartMs: number): RegistrationPin[] {
  return draft.pins.map((pin) => ({
    xPx: pin.xPx,
    yPx: pin.yPx,
    hours: (Date.parse(pin.time) - chartStartMs) / MS_PER_HOUR,
    pressure: pin.pressure,
  }));
}

/** Fits the pins; throws RegistrationError for pins that cannot register the chart. */
export function registerDraft(form: ChartForm, draft: InkLineDraft, chartStartMs: number): RegistrationFit {
  return fitRegistration(form, toRegistrationPins(draft, chartStartMs));
}

/**
 * The uncertainty budget of a hand-in: the registration's RMS along pressure and time, and the centring of
 * hand-placed knots within the pen line's width. No instrument or clock correction is applied yet, so their
 * terms are 0 (the figure is the tracing's own uncertainty, not the station pressure's).
 */
export function handInUncertaintyBudget(form: ChartForm, fit: RegistrationFit): UncertaintyBudget {
  return {
    registrationRmsHpa: fit.rmsHpa,
    registrationRmsMinutes: fit.rmsMinutes,
    // Every knot of a draft is placed by hand on the Bench, so each carries the centring term.
    lineCentringHpa: lineCentringUncertaintyHpa(form, PEN_LINE_WIDTH_MM),
    instrumentRmsHpa: 0,
    clockRmsMinutes: 0,
  };
}

/**
 * Reads every knot through the fit (time UTC ms, hPa), resamples to hourly points and gives each valued point
 * its uncertainty (hPa, 1σ; null off scale). Gap points (no pressure) are left out: the series marks a gap by
 * the absence of points, since a SeriesPoint always carries a pressure.
 */
export function readSeriesPoints(form: ChartForm, fit: RegistrationFit, draft: InkLineDraft, chartStartMs: number): NewSeriesPoint[] {
  const samples: TimedPressure[] = draft.knots.map((knot) => {
    const reading = pixelToReading(form, fit, knot.xPx, knot.yPx);
    return {
      timeMs: chartStartMs + reading.hours * MS_PER_HOUR,
      pressureHpa: toHpa(reading.pressure, form.pressureUnit),
      isOffScale: reading.pressure < form.pressureMin || reading.pressure > form.pressureMax,
    };
  });
  const resampled = resampleRegular(samples, { stepMinutes: SERIES_STEP_MINUTES, maxGapMinutes: SERIES_MAX_GAP_MINUTES });
  // Gaps stay in until the uncertainty is set, so the slope next to a gap is taken one-sided, not across it.
  const points = applyUncertainty(resampled, handInUncertaintyBudget(form, fit));
  return points.flatMap((point) =>
    point.pressureHpa === null
      ? []
      : [{ timeMs: point.timeMs, pressureHpa: point.pressureHpa, uncertaintyHpa: point.uncertaintyHpa, flag: point.flag }],
  );
}
