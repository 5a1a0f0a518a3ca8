import { instrumentWordsInput } from '@shared/api/correction-words';
import type { InkLineSaved, PinInput } from '@shared/api/ink-lines';
import type { ChartForm } from '@shared/domain/chart-form';
import type { PipelineResult } from '@shared/domain/pipeline/digitize-line';
export { computeHandIn } from '@shared/domain/pipeline/digitize-work';
import type { NewSeriesPoint } from '../series/series.repository';
import { fitRegistration, type RegistrationFit, type RegistrationPin } from '@shared/domain/registration';
import type { StoredInkLineResult } from './ink-line.table';

/** The valued points of the series (a gap is the absence of points, since a stored point always has a pressure). */
export function seriesPointsOf(result: PipelineResult): NewSeriesPoint[] {
  return result.series.flatMap((point) =>
    point.pressureHpa === null ? [] : [{ timeMs: point.timeMs, pressureHpa: point.pressureHpa, uncertaintyHpa: point.uncertaintyHpa, flag: point.flag }],
  );
}

/** What is stored with the line: the volunteer's summary and the corrections with their residuals. */
export function storedResultOf(result: PipelineResult, points: NewSeriesPoint[]): StoredInkLineResult {
  const { registration, clock, instrument } = result;
  const first = points[0];
  const usedReadings = result.checkReadingUses.filter((use) => use === 'used').length;
  const summary: StoredInkLineResult['summary'] = {
    registrationModel: registration.model,
    registrationRmsHpa: registration.rmsHpa,
    registrationRmsMinutes: registration.rmsMinutes,
    pinResiduals: registration.residuals.map((r) => ({ index: r.index, pressureHpa: r.pressureHpa, minutes: r.minutes })),
    pipelineVersion: result.pipelineVersion,
    clock:
      clock && clock.method !== 'none'
        ? { method: clock.method, rmsMinutes: clock.rmsMinutes, rateMinutesPerDay: clock.rateMinutesPerDay, markCount: clock.knots.length }
        : null,
    instrument:
      instrument && instrument.method !== 'none'
        ? {
            method: instrument.method,
            rmsHpa: instrument.rmsHpa,
            meanOffsetHpa: instrumentWordsInput(instrument).meanOffsetHpa,
            readingCount: usedReadings,
          }
        : null,
    seriesPointCount: points.length,
    firstPoint: first ? { time: new Date(first.timeMs).toISOString(), pressureHpa: first.pressureHpa, flag: first.flag } : null,
  };
  return {
    summary,
    corrections: {
      clock,
      instrument,
      matchedMarks: result.matchedMarks,
      droppedMarkChartTimesMs: result.droppedMarkChartTimesMs,
      checkReadingUses: result.checkReadingUses,
    },
  };
}

export function savedView(line: { id: string; scanId: string; status: InkLineSaved['status']; version: number }, result: StoredInkLineResult): InkLineSaved {
  return { inkLineId: line.id, scanId: line.scanId, status: line.status, version: line.version, ...result.summary };
}

const MS_PER_HOUR = 3_600_000;

/** Pins as the fit wants them: hours after the chart's chart start instead of ISO times. */
export function toRegistrationPins(draft: { pins: PinInput[]; knots?: unknown }, chartStartMs: number): RegistrationPin[] {
  return draft.pins.map((pin) => ({ xPx: pin.xPx, yPx: pin.yPx, hours: (Date.parse(pin.time) - chartStartMs) / MS_PER_HOUR, pressure: pin.pressure }));
}

/** Fits the pins alone (Follow ink needs the registration before there is a line); throws RegistrationError. */
export function registerDraft(form: ChartForm, draft: { pins: PinInput[]; knots?: unknown }, chartStartMs: number): RegistrationFit {
  return fitRegistration(form, toRegistrationPins(draft, chartStartMs));
}
