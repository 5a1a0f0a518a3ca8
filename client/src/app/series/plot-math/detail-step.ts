import { maxSeriesRangeMs, SERIES_STEP_NOMINAL_MS, SERIES_STEPS, type SeriesStep } from '@shared/api/series-query';

/** About this many points per station fill the detail plot: more are finer than its pixels. */
export const DETAIL_TARGET_POINTS = 1500;

/**
 * The finest step that gives at most `targetPoints` points per station over the visible range and that the
 * server admits for that many stations (SERIES_MAX_ROWS); monthly when nothing finer does.
 * Decades come back monthly or daily, a week hourly or raw, an afternoon raw.
 */
export function chooseDetailStep(rangeMs: number, stationCount: number, targetPoints = DETAIL_TARGET_POINTS): SeriesStep {
  return (
    SERIES_STEPS.find((step) => rangeMs / SERIES_STEP_NOMINAL_MS[step] <= targetPoints && rangeMs <= maxSeriesRangeMs(step, stationCount)) ?? 'monthly'
  );
}

/** Words for a step, for the line under the plot. */
export const STEP_WORDS: Readonly<Record<SeriesStep, string>> = {
  raw: 'every traced point',
  '10min': '10-minute means',
  hourly: 'hourly means',
  daily: 'daily means',
  monthly: 'monthly means',
};

/**
 * The range to fetch for a view: the view widened by half its span on each side (so a small pan needs no new
 * request), cut to the record, with both ends on whole minutes so repeated views share one request.
 */
export function fetchWindowMs(viewMs: readonly [number, number], recordMs: readonly [number, number]): [number, number] {
  const spanMs = viewMs[1] - viewMs[0];
  const minute = 60_000;
  const fromMs = Math.max(recordMs[0], Math.floor((viewMs[0] - spanMs / 2) / minute) * minute);
  const toMs = Math.min(recordMs[1], Math.ceil((viewMs[1] + spanMs / 2) / minute) * minute);
  return [fromMs, Math.max(fromMs + minute, toMs)];
}

/** True when the fetched window covers the view and was fetched at the step the view asks for. */
export function windowServes(window: { fromMs: number; toMs: number; step: SeriesStep } | null, viewMs: readonly [number, number], step: SeriesStep): boolean {
  return window !== null && window.step === step && window.fromMs <= viewMs[0] && window.toMs >= viewMs[1];
}
