import type { InkLineDraft } from '@shared/api/ink-lines';
import type { ChartForm } from '@shared/domain/chart-form';
import { fitRegistration, pixelToReading, type RegistrationFit, type RegistrationPin } from '@shared/domain/registration';
import { toHpa } from '@shared/domain/pressure-units';
import { resampleRegular, type TimedPressure } from '@shared/domain/resample';
import type { NewSeriesPoint } from '../series/series.repository';

const MS_PER_HOUR = 3_600_000;
/** Hourly points; a span of more than three hours without knots is a gap (common practice for hourly series). */
const SERIES_STEP_MINUTES = 60;
const SERIES_MAX_GAP_MINUTES = 180;

/** Pins as the fit wants them: hours after the chart's period start instead of ISO times. */
export function toRegistrationPins(draft: InkLineDraft, periodStartMs: number): RegistrationPin[] {
  return draft.pins.map((pin) => ({
    xPx: pin.xPx,
    yPx: pin.yPx,
    hours: (Date.parse(pin.time) - periodStartMs) / MS_PER_HOUR,
    pressure: pin.pressure,
  }));
}

/** Fits the pins; throws RegistrationError for pins that cannot register the chart. */
export function registerDraft(form: ChartForm, draft: InkLineDraft, periodStartMs: number): RegistrationFit {
  return fitRegistration(form, toRegistrationPins(draft, periodStartMs));
}

/**
 * Reads every knot through the fit (time UTC ms, hPa) and resamples to hourly points.
 * Gap points (no pressure) are left out: the series marks a gap by the absence of points, since a
 * SeriesPoint always carries a pressure.
 */
export function readSeriesPoints(form: ChartForm, fit: RegistrationFit, draft: InkLineDraft, periodStartMs: number): NewSeriesPoint[] {
  const samples: TimedPressure[] = draft.knots.map((knot) => {
    const reading = pixelToReading(form, fit, knot.xPx, knot.yPx);
    return {
      timeMs: periodStartMs + reading.hours * MS_PER_HOUR,
      pressureHpa: toHpa(reading.pressure, form.pressureUnit),
      isOffScale: reading.pressure < form.pressureMin || reading.pressure > form.pressureMax,
    };
  });
  const points = resampleRegular(samples, { stepMinutes: SERIES_STEP_MINUTES, maxGapMinutes: SERIES_MAX_GAP_MINUTES });
  return points.flatMap((point) =>
    point.pressureHpa === null
      ? []
      : [{ timeMs: point.timeMs, pressureHpa: point.pressureHpa, uncertaintyHpa: point.uncertaintyHpa, flag: point.flag }],
  );
}
