import { SERIES_MAX_ROWS } from '@shared/api/series-query';

import { chooseDetailStep, fetchWindowMs, windowServes } from './detail-step';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;
const YEAR_MS = 365.25 * DAY_MS;

describe('chooseDetailStep', () => {
  it.each([
    ['an afternoon', 4 * HOUR_MS, 1, 'raw'],
    ['a week', 7 * DAY_MS, 1, 'raw'],
    ['a month', 31 * DAY_MS, 1, 'hourly'],
    ['a year', YEAR_MS, 1, 'daily'],
    ['a century', 100 * YEAR_MS, 1, 'monthly'],
  ] as const)('when the view spans %s for one station, then the step is %s', (_name, rangeMs, stations, expected) => {
    const step = chooseDetailStep(rangeMs, stations);

    expect(step).toBe(expected);
  });

  it('when the finest step by pixels is over the server limit for ten stations, then a coarser one is chosen', () => {
    // 10 stations share SERIES_MAX_ROWS: 10 000 rows each; a 3-year range at daily is ~1 100 rows, fine; at
    // a target of 1e6 points the daily limit per station is what decides.
    const rangeMs = ((SERIES_MAX_ROWS / 10) * HOUR_MS) + DAY_MS;

    const step = chooseDetailStep(rangeMs, 10, 1e9);

    expect(step).toBe('daily');
  });
});

describe('fetchWindowMs', () => {
  it('when the view is inside the record, then the window adds half the span either side on whole minutes', () => {
    const window = fetchWindowMs([10 * HOUR_MS, 12 * HOUR_MS], [0, 100 * HOUR_MS]);

    expect(window).toEqual([9 * HOUR_MS, 13 * HOUR_MS]);
  });

  it('when the view reaches the record ends, then the window stops at them', () => {
    const window = fetchWindowMs([0, 4 * HOUR_MS], [0, 5 * HOUR_MS]);

    expect(window).toEqual([0, 5 * HOUR_MS]);
  });
});

describe('windowServes', () => {
  it('when the fetched window covers the view at its step, then it serves', () => {
    expect(windowServes({ fromMs: 0, toMs: 10, step: 'hourly' }, [2, 8], 'hourly')).toBe(true);
  });

  it.each([
    ['the step differs', { fromMs: 0, toMs: 10, step: 'daily' as const }, [2, 8]],
    ['the view runs past it', { fromMs: 0, toMs: 10, step: 'hourly' as const }, [2, 12]],
    ['nothing was fetched', null, [2, 8]],
  ])('when %s, then it does not serve', (_name, window, view) => {
    expect(windowServes(window, view as [number, number], 'hourly')).toBe(false);
  });
});
