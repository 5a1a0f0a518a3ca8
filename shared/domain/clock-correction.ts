/**
 * Drum clock error from time marks and chart on / chart off: chart time (read off the chart, epoch ms) →
 * true time (epoch ms, UTC). One mark gives a constant offset, two a constant rate, three or more a
 * piecewise-linear correction through every mark; beyond the end marks the nearest segment's rate holds.
 */

/** Where a clock mark came from: an observer's time mark, or the written chart-on / chart-off time. */
export type ClockMarkKind = 'time_mark' | 'chart_on' | 'chart_off';

/** A pair of times for one point of the pen line: chart time read off the chart and the true UTC time (epoch ms). */
export interface ClockMark {
  chartTimeMs: number;
  trueTimeMs: number;
  kind: ClockMarkKind;
}

/** How the correction was built: no marks, one (offset), two (rate), three or more (piecewise). */
export type ClockCorrectionMethod = 'none' | 'offset' | 'rate' | 'piecewise';

/**
 * One mark's residual. errorMinutes: true − chart time. leaveOneOutMinutes: true time minus the time the other
 * marks predict for it (null when too few marks remain), the honest measure of the correction between marks.
 */
export interface ClockMarkResidual {
  chartTimeMs: number;
  errorMinutes: number;
  leaveOneOutMinutes: number | null;
}

/** A fitted clock correction; knots sorted by chart time. rateMinutesPerDay: the drum's mean gain (+) or loss (−). */
export interface ClockCorrection {
  method: ClockCorrectionMethod;
  knots: { chartTimeMs: number; trueTimeMs: number }[];
  residuals: ClockMarkResidual[];
  rmsMinutes: number;
  rateMinutesPerDay: number;
}

/** Thrown for marks that cannot come from one running drum. */
export class ClockCorrectionError extends Error {
  constructor(
    readonly code: 'contradictory_marks' | 'invalid_mark',
    message: string,
  ) {
    super(message);
    this.name = 'ClockCorrectionError';
  }
}

const MS_PER_MINUTE = 60_000;
const MS_PER_DAY = 86_400_000;

/** Builds the clock correction from any number of marks (any order). Throws ClockCorrectionError for contradictions. */
export function fitClockCorrection(marks: ClockMark[]): ClockCorrection {
  marks.forEach((m, i) => {
    if (!Number.isFinite(m.chartTimeMs) || !Number.isFinite(m.trueTimeMs)) throw new ClockCorrectionError('invalid_mark', `mark ${i + 1} has a missing time`);
  });
  const knots = marks.map((m) => ({ chartTimeMs: m.chartTimeMs, trueTimeMs: m.trueTimeMs })).sort((a, b) => a.chartTimeMs - b.chartTimeMs);
  for (let i = 1; i < knots.length; i++) {
    if (knots[i].chartTimeMs === knots[i - 1].chartTimeMs && knots[i].trueTimeMs !== knots[i - 1].trueTimeMs) {
      throw new ClockCorrectionError('contradictory_marks', 'two marks at the same chart time give different true times');
    }
    if (knots[i].trueTimeMs < knots[i - 1].trueTimeMs) {
      // A running drum never moves backwards: true time must grow with chart time.
      throw new ClockCorrectionError('contradictory_marks', 'the marks put true time backwards along the chart; check their order and dates');
    }
  }
  const unique = knots.filter((k, i) => i === 0 || k.chartTimeMs !== knots[i - 1].chartTimeMs);
  const method: ClockCorrectionMethod = unique.length === 0 ? 'none' : unique.length === 1 ? 'offset' : unique.length === 2 ? 'rate' : 'piecewise';
  const residuals = unique.map((k, i) => {
    const others = unique.filter((_, j) => j !== i);
    const leaveOneOutMinutes = others.length >= 2 ? (k.trueTimeMs - interpolate(others, k.chartTimeMs)) / MS_PER_MINUTE : null;
    return { chartTimeMs: k.chartTimeMs, errorMinutes: (k.trueTimeMs - k.chartTimeMs) / MS_PER_MINUTE, leaveOneOutMinutes };
  });
  const looValues = residuals.map((r) => r.leaveOneOutMinutes).filter((x): x is number => x !== null);
  const rmsMinutes = looValues.length === 0 ? 0 : Math.sqrt(looValues.reduce((s, x) => s + x * x, 0) / looValues.length);
  const first = unique[0];
  const last = unique[unique.length - 1];
  const rateMinutesPerDay =
    unique.length >= 2 ? ((last.trueTimeMs - first.trueTimeMs) / (last.chartTimeMs - first.chartTimeMs) - 1) * (MS_PER_DAY / MS_PER_MINUTE) : 0;
  return { method, knots: unique, residuals, rmsMinutes, rateMinutesPerDay };
}

/** Chart time (epoch ms) → true UTC time (epoch ms). */
export function correctChartTime(correction: ClockCorrection, chartTimeMs: number): number {
  return correction.knots.length === 0 ? chartTimeMs : interpolate(correction.knots, chartTimeMs);
}

/** True UTC time (epoch ms) → chart time (epoch ms), the inverse of correctChartTime. */
export function chartTimeFromTrue(correction: ClockCorrection, trueTimeMs: number): number {
  if (correction.knots.length === 0) return trueTimeMs;
  const swapped = correction.knots.map((k) => ({ chartTimeMs: k.trueTimeMs, trueTimeMs: k.chartTimeMs }));
  return interpolate(swapped, trueTimeMs);
}

/** Piecewise-linear through sorted knots; one knot shifts by its offset; outside, the end segment extends. */
function interpolate(knots: { chartTimeMs: number; trueTimeMs: number }[], chartTimeMs: number): number {
  if (knots.length === 1) return chartTimeMs + (knots[0].trueTimeMs - knots[0].chartTimeMs);
  let i = 0;
  while (i < knots.length - 2 && knots[i + 1].chartTimeMs < chartTimeMs) i++;
  const a = knots[i];
  const b = knots[i + 1];
  const weight = (chartTimeMs - a.chartTimeMs) / (b.chartTimeMs - a.chartTimeMs);
  return a.trueTimeMs + weight * (b.trueTimeMs - a.trueTimeMs);
}
