import { chartTimeFromTrue, type ClockMark, correctChartTime, fitClockCorrection } from './clock-correction';

const minuteMs = 60_000;
const hourMs = 3_600_000;
const chartOn = Date.UTC(2026, 2, 2, 9, 0);

function mark(chartHours: number, errorMinutes: number, kind: ClockMark['kind'] = 'time_mark'): ClockMark {
  const chartTimeMs = chartOn + chartHours * hourMs;
  return { chartTimeMs, trueTimeMs: chartTimeMs + errorMinutes * minuteMs, kind };
}

describe('fitClockCorrection', () => {
  it('when no marks are given, then chart time is true time', () => {
    const correction = fitClockCorrection([]);

    expect(correction.method).toBe('none');
    expect(correctChartTime(correction, chartOn + 5 * hourMs)).toBe(chartOn + 5 * hourMs);
  });

  it('when only chart on is known, then the correction is its constant offset', () => {
    const correction = fitClockCorrection([mark(0, 12, 'chart_on')]);

    expect(correction.method).toBe('offset');
    expect(correctChartTime(correction, chartOn + 100 * hourMs)).toBe(chartOn + 100 * hourMs + 12 * minuteMs);
  });

  it('when only chart on and chart off are known, then the drum runs at a constant rate between them', () => {
    // A drum that loses 21 minutes over the week: 3 minutes per day.
    const correction = fitClockCorrection([mark(0, 0, 'chart_on'), mark(168, 21, 'chart_off')]);

    expect(correction.method).toBe('rate');
    expect(correction.rateMinutesPerDay).toBeCloseTo(3, 9);
    expect((correctChartTime(correction, chartOn + 84 * hourMs) - (chartOn + 84 * hourMs)) / minuteMs).toBeCloseTo(10.5, 9);
    expect(correction.residuals.every((r) => r.leaveOneOutMinutes === null)).toBe(true);
  });

  it.each<[number, number]>([
    [0, 0],
    [24, 5],
    [36, 7.5],
    [108, 13],
    [48, 10],
    [96, 10],
    [120, 16],
  ])('when marks say 0, 10, 10, 16 minutes at 0, 48, 96, 120 h, then at %f h the error is %f minutes', (hours, expectedMinutes) => {
    const correction = fitClockCorrection([mark(120, 16, 'chart_off'), mark(48, 10), mark(0, 0, 'chart_on'), mark(96, 10)]);

    const trueTimeMs = correctChartTime(correction, chartOn + hours * hourMs);

    expect(correction.method).toBe('piecewise');
    expect((trueTimeMs - (chartOn + hours * hourMs)) / minuteMs).toBeCloseTo(expectedMinutes, 9);
  });

  it('when three or more marks are given, then each mark’s leave-one-out residual is reported', () => {
    const correction = fitClockCorrection([mark(0, 0), mark(48, 10), mark(96, 10)]);

    // Middle mark predicted from the ends: 5 min, shows 10 → +5. Each end extrapolated from the other two: 10 and 20 min → −10.
    expect(correction.residuals.map((r) => r.leaveOneOutMinutes)).toEqual([expect.closeTo(-10, 9), expect.closeTo(5, 9), expect.closeTo(-10, 9)]);
    expect(correction.rmsMinutes).toBeCloseTo(Math.sqrt((100 + 25 + 100) / 3), 9);
    expect(correction.residuals.map((r) => r.errorMinutes)).toEqual([0, 10, 10]);
  });

  it('when a true time is mapped back, then the chart time returns', () => {
    const correction = fitClockCorrection([mark(0, 3), mark(48, 10), mark(96, 14)]);
    const chartTimeMs = chartOn + 70.25 * hourMs;

    const back = chartTimeFromTrue(correction, correctChartTime(correction, chartTimeMs));

    expect(back).toBeCloseTo(chartTimeMs, 3);
  });

  it.each<[string, ClockMark[], string]>([
    ['two marks at one chart time with different true times', [mark(10, 0), mark(10, 5)], 'contradictory_marks'],
    ['marks that put true time backwards', [mark(10, 0), { ...mark(11, 0), trueTimeMs: chartOn + 9 * hourMs }], 'contradictory_marks'],
    ['a mark without a true time', [{ ...mark(10, 0), trueTimeMs: Number.NaN }], 'invalid_mark'],
  ])('when given %s, then it throws %s', (_label, marks, code) => {
    const act = () => fitClockCorrection(marks);

    expect(act).toThrow(expect.objectContaining({ code }));
  });
});
