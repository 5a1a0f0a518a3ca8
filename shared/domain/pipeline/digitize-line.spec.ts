import { readingToPixel } from '../registration';
import { TEST_WEEKLY_FORM } from '../testing/test-weekly-form';
import { TEST_WEEKLY_PLACEMENT } from '../testing/test-weekly-placement';
import { digitizeLine, type PipelineInput, type PipelineLine } from './digitize-line';

// An invented chart with known errors (exact by construction, no published source needed): the drum clock runs
// 20 min slow at chart start and loses 4 min a day more; the barograph reads 1.3 hPa high. The pipeline must
// give the true pressure at true time once marks and check readings are given.
const form = TEST_WEEKLY_FORM;
const HOUR_MS = 3_600_000;
const CHART_START_MS = Date.parse('2026-03-02T00:00:00Z');
const placement = TEST_WEEKLY_PLACEMENT;
const CLOCK_SLOW_MINUTES = 20;
const CLOCK_LOSS_MINUTES_PER_DAY = 4;
const INSTRUMENT_HIGH_HPA = 1.3;

const truePressureHpa = (trueMs: number) => 1000 + 12 * Math.sin((2 * Math.PI * (trueMs - CHART_START_MS)) / (72 * HOUR_MS));
/** True time of a chart time: the slow clock lags more and more. */
const trueOfChart = (chartMs: number) =>
  chartMs + (CLOCK_SLOW_MINUTES + (CLOCK_LOSS_MINUTES_PER_DAY * (chartMs - CHART_START_MS)) / (24 * HOUR_MS)) * 60_000;
/** Chart time of a true time (inverse of trueOfChart, linear). */
const chartOfTrue = (trueMs: number) => {
  const rate = 1 + CLOCK_LOSS_MINUTES_PER_DAY / (24 * 60);
  return CHART_START_MS + (trueMs - CHART_START_MS - CLOCK_SLOW_MINUTES * 60_000) / rate;
};
const pixelAtChart = (chartMs: number) =>
  readingToPixel(form, placement, { hours: (chartMs - CHART_START_MS) / HOUR_MS, pressure: truePressureHpa(trueOfChart(chartMs)) + INSTRUMENT_HIGH_HPA });

function pinAt(hours: number, pressure: number) {
  const { xPx, yPx } = readingToPixel(form, placement, { hours, pressure });
  return { xPx, yPx, timeMs: CHART_START_MS + hours * HOUR_MS, pressure };
}

function knotLine(fromHours: number, toHours: number): PipelineLine {
  const xPx: number[] = [];
  const yPx: number[] = [];
  for (let minutes = fromHours * 60; minutes <= toHours * 60; minutes += 10) {
    const p = pixelAtChart(CHART_START_MS + minutes * 60_000);
    xPx.push(p.xPx);
    yPx.push(p.yPx);
  }
  return { xPx, yPx, confidence: null, spans: [], bridgesAfter: [], lineWidthPx: null, foundTimeMarks: [] };
}

function input(overrides: Partial<PipelineInput> = {}): PipelineInput {
  const markTimes = ['2026-03-02T08:00:00Z', '2026-03-02T20:00:00Z', '2026-03-03T08:00:00Z'].map(Date.parse);
  return {
    form,
    chartStartMs: CHART_START_MS,
    pins: [pinAt(24, 1040), pinAt(144, 1040), pinAt(144, 960), pinAt(24, 960), pinAt(72, 1000)],
    ink: knotLine(2, 40),
    timeMarks: markTimes.map((trueTimeMs) => ({ trueTimeMs, ...pixelAtChart(chartOfTrue(trueTimeMs)) })),
    chartOnMs: null,
    chartOffMs: null,
    checkReadings: markTimes.map((timeMs) => ({ timeMs, pressureHpa: truePressureHpa(timeMs) })),
    ...overrides,
  };
}

function worstErrorHpa(series: { timeMs: number; pressureHpa: number | null }[]): number {
  return Math.max(...series.filter((p) => p.pressureHpa !== null).map((p) => Math.abs((p.pressureHpa as number) - truePressureHpa(p.timeMs))));
}

describe('digitizeLine', () => {
  it('when marks and check readings are given, then the series is corrected for clock and instrument error', () => {
    const result = digitizeLine(input());

    expect(result.clock?.method).toBe('piecewise');
    // The fitted rate is the drum's gain (+) or loss (−) of chart time against true time: a slow drum gains true time.
    expect(result.clock?.rateMinutesPerDay).toBeCloseTo(CLOCK_LOSS_MINUTES_PER_DAY, 1);
    expect(result.instrument?.method).toBe('drift');
    expect(result.instrument?.knots.every((k) => Math.abs(k.offsetHpa + INSTRUMENT_HIGH_HPA) < 0.02)).toBe(true);
    expect(result.checkReadingUses).toEqual(['used', 'used', 'used']);
    expect(result.series.length).toBeGreaterThan(30);
    // Knots 10 min apart on a 72-hour swing: linear interpolation is within 0.01 hPa of the curve.
    expect(worstErrorHpa(result.series)).toBeLessThan(0.05);
  });

  it('when no marks and no readings are given, then the series keeps the clock and instrument error', () => {
    const result = digitizeLine(input({ timeMarks: [], checkReadings: [] }));

    expect(result.clock).toBeNull();
    expect(result.instrument).toBeNull();
    expect(worstErrorHpa(result.series)).toBeGreaterThan(1);
  });

  it('when a check reading is mistyped by 5 hPa, then it is left out as an outlier and the others correct the line', () => {
    const base = input();
    const checks = [...base.checkReadings, { timeMs: Date.parse('2026-03-02T14:00:00Z'), pressureHpa: truePressureHpa(Date.parse('2026-03-02T14:00:00Z')) + 5 }];

    const result = digitizeLine({ ...base, checkReadings: checks });

    expect(result.checkReadingUses).toEqual(['used', 'used', 'used', 'outlier']);
    expect(worstErrorHpa(result.series)).toBeLessThan(0.05);
  });

  it('when the line has a gap and a bridge, then the gap hours have no value and the bridged hours are interpolated', () => {
    const line = knotLine(2, 40);
    // Knot i runs at 2 h + 10 min · i: a gap after knot 30 (07:00 chart time) to knot 60 (12:00), a bridge after knot 120.
    const xPx = [...Array.from(line.xPx).slice(0, 31), ...Array.from(line.xPx).slice(60)];
    const yPx = [...Array.from(line.yPx).slice(0, 31), ...Array.from(line.yPx).slice(60)];
    const bridgeAt = 100;
    xPx.splice(bridgeAt + 1, 12);
    yPx.splice(bridgeAt + 1, 12);
    const ink: PipelineLine = { ...line, xPx, yPx, spans: [{ kind: 'gap', startIndex: 30, endIndex: 31 }], bridgesAfter: [bridgeAt] };

    const result = digitizeLine(input({ ink, timeMarks: [], checkReadings: [] }));

    const valued = result.series.filter((p) => p.pressureHpa !== null);
    const inGap = valued.filter((p) => p.timeMs > CHART_START_MS + 7.5 * HOUR_MS && p.timeMs < CHART_START_MS + 11.5 * HOUR_MS);
    expect(inGap).toEqual([]);
    expect(result.series.some((p) => p.flag === 'gap')).toBe(true);
    expect(result.series.filter((p) => p.flag === 'interpolated').length).toBeGreaterThanOrEqual(1);
  });

  it('when chart on and chart off are the only clock marks, then the clock is corrected from the ends of the line', () => {
    const line = knotLine(2, 40);
    const onMs = trueOfChart(CHART_START_MS + 2 * HOUR_MS);
    const offMs = trueOfChart(CHART_START_MS + 40 * HOUR_MS);

    const result = digitizeLine(input({ ink: line, timeMarks: [], chartOnMs: onMs, chartOffMs: offMs }));

    expect(result.clock?.method).toBe('rate');
    expect(result.matchedMarks.map((m) => m.kind)).toEqual(['chart_on', 'chart_off']);
    expect(worstErrorHpa(result.series)).toBeLessThan(0.05);
  });
});
