import { EMPTY_BENCH_WORK, type BenchWork, type WorkKnot } from '../api/bench-work';
import { bridgeStretch, liftStretch, nearestKnotIndex } from './knot-edits';
import { digitizeWork } from './pipeline/digitize-work';
import { readingToPixel } from './registration';
import { TEST_WEEKLY_FORM } from './testing/test-weekly-form';
import { TEST_WEEKLY_PLACEMENT } from './testing/test-weekly-placement';

// An invented chart, exact by construction: the test form at 150 dpi, a pressure of 1000 + 0.5 hPa per hour.
const form = TEST_WEEKLY_FORM;
const HOUR_MS = 3_600_000;
const CHART_START = '2026-03-02T00:00:00.000Z';
const CHART_START_MS = Date.parse(CHART_START);
const placement = TEST_WEEKLY_PLACEMENT;
const pixelAt = (hours: number, pressure: number) => readingToPixel(form, placement, { hours, pressure });
const pin = (hours: number, pressure: number) => ({ ...pixelAt(hours, pressure), time: new Date(CHART_START_MS + hours * HOUR_MS).toISOString(), pressure });
/** Hand-placed knots every 10 minutes from 2 h to 30 h. */
const KNOTS: WorkKnot[] = Array.from({ length: 169 }, (_, i) => pixelAt(2 + i / 6, 1000 + 0.5 * (2 + i / 6)));
const knotAt = (hours: number) => Math.round((hours - 2) * 6);
const work = (knots: readonly WorkKnot[]): BenchWork => ({
  ...EMPTY_BENCH_WORK,
  pins: [pin(24, 1040), pin(144, 1040), pin(144, 960), pin(24, 960), pin(72, 1000)],
  knots: [...knots],
});
const pointAt = <T extends { timeMs: number }>(series: T[], hours: number): T | undefined => series.find((p) => p.timeMs === CHART_START_MS + hours * HOUR_MS);

describe('liftStretch and bridgeStretch', () => {
  const line: WorkKnot[] = [
    { xPx: 0, yPx: 0, confidence: 0.9 },
    { xPx: 10, yPx: 0, confidence: 0.9, gapAfter: true },
    { xPx: 20, yPx: 0 },
    { xPx: 30, yPx: 0 },
    { xPx: 40, yPx: 0 },
  ];

  it('when a stretch is lifted, then the knots inside go and a gap follows its first knot', () => {
    expect(liftStretch(line, 3, 0)).toEqual([{ xPx: 0, yPx: 0, confidence: 0.9, gapAfter: true }, line[3], line[4]]);
  });

  it('when a gap is bridged, then the gap closes and the stretch is a bridge', () => {
    expect(bridgeStretch(line, 1, 2)).toEqual([line[0], { xPx: 10, yPx: 0, confidence: 0.9, bridgeAfter: true }, line[2], line[3], line[4]]);
  });

  it.each([
    ['one knot twice', 2, 2],
    ['a knot past the end', 1, 9],
  ])('when the stretch is %s, then the line is the same list (no Undo step)', (_case, a, b) => {
    expect(liftStretch(line, a, b)).toBe(line);
    expect(bridgeStretch(line, a, b)).toBe(line);
  });

  it('when a point is near the line, then the nearest knot is found; an empty line has none', () => {
    expect(nearestKnotIndex(line, { xPx: 27, yPx: 4 })).toBe(3);
    expect(nearestKnotIndex([], { xPx: 27, yPx: 4 })).toBeNull();
  });
});

describe('lift and bridge in the series (shared pipeline, as at hand-in)', () => {
  it('when 10 h to 14 h is lifted, then the hours inside are gaps with no value and the hours outside keep theirs', () => {
    const lifted = liftStretch(KNOTS, knotAt(10), knotAt(14));

    const { series } = digitizeWork(form, CHART_START_MS, work(lifted));

    for (const hours of [11, 12, 13]) expect(pointAt(series, hours)).toMatchObject({ flag: 'gap', pressureHpa: null });
    expect(pointAt(series, 9)?.flag).toBe('ok');
    expect(pointAt(series, 15)?.pressureHpa).toBeCloseTo(1007.5, 2);
  });

  it('when a 40-minute skip over 21:00 is bridged, then the 21:00 value is flagged interpolated; left unbridged it is ok', () => {
    // 40 min is under the hourly step, so only the volunteer's bridge makes it interpolated (resample.ts).
    const skipped = [...KNOTS.slice(0, knotAt(20 + 40 / 60) + 1), ...KNOTS.slice(knotAt(21 + 20 / 60))];
    const from = knotAt(20 + 40 / 60);
    const bridged = bridgeStretch(skipped, from, from + 1);

    const withBridge = digitizeWork(form, CHART_START_MS, work(bridged)).series;
    const withoutBridge = digitizeWork(form, CHART_START_MS, work(skipped)).series;

    expect(pointAt(withBridge, 21)).toMatchObject({ flag: 'interpolated' });
    expect(pointAt(withBridge, 21)?.pressureHpa).toBeCloseTo(1010.5, 2);
    expect(pointAt(withoutBridge, 21)?.flag).toBe('ok');
  });
});
