/**
 * Instrument error from check readings (station barometer readings at known times). Default: the offset
 * barometer − chart at each reading, interpolated linearly through time (drift) and held beyond the first
 * and last reading. With readings spread over the pressure range, optionally a scale error: p = a + b·p_chart.
 */

/** A check reading: UTC epoch ms, the chart's pressure at that time and the barometer's, both hPa. */
export interface CheckReading {
  timeMs: number;
  chartPressureHpa: number;
  barometerPressureHpa: number;
}

/** How the correction was built: no readings, one (offset), several (drift through time) or a scale fit. */
export type InstrumentCorrectionMethod = 'none' | 'offset' | 'drift' | 'scale';

/**
 * One reading's residual in hPa. For drift and offset: the reading minus what the other readings predict for it
 * (leave-one-out; null with a single reading). For scale: the reading minus the fitted line.
 */
export interface CheckReadingResidual {
  timeMs: number;
  offsetHpa: number;
  residualHpa: number | null;
}

/** A fitted instrument correction; knots sorted by time; scale set only for the 'scale' method. */
export interface InstrumentCorrection {
  method: InstrumentCorrectionMethod;
  knots: { timeMs: number; offsetHpa: number }[];
  scale: { offsetHpa: number; factor: number } | null;
  residuals: CheckReadingResidual[];
  rmsHpa: number;
}

/** Thrown for check readings that cannot give the asked correction. */
export class InstrumentCorrectionError extends Error {
  constructor(
    readonly code: 'contradictory_readings' | 'scale_needs_spread' | 'invalid_reading',
    message: string,
  ) {
    super(message);
    this.name = 'InstrumentCorrectionError';
  }
}

/** Options: fitScale asks for a + b·p; minSpanHpa (default 20 hPa) is the chart-pressure spread it needs, over ≥ 3 readings. */
export interface InstrumentCorrectionOptions {
  fitScale?: boolean;
  minSpanHpa?: number;
}

/** Builds the instrument correction from check readings (any order). */
export function fitInstrumentCorrection(readings: CheckReading[], options: InstrumentCorrectionOptions = {}): InstrumentCorrection {
  readings.forEach((r, i) => {
    if (![r.timeMs, r.chartPressureHpa, r.barometerPressureHpa].every(Number.isFinite)) {
      throw new InstrumentCorrectionError('invalid_reading', `check reading ${i + 1} has a missing value`);
    }
  });
  const sorted = readings.slice().sort((a, b) => a.timeMs - b.timeMs);
  const knots = sorted.map((r) => ({ timeMs: r.timeMs, offsetHpa: r.barometerPressureHpa - r.chartPressureHpa }));
  for (let i = 1; i < knots.length; i++) {
    if (knots[i].timeMs === knots[i - 1].timeMs && knots[i].offsetHpa !== knots[i - 1].offsetHpa) {
      throw new InstrumentCorrectionError('contradictory_readings', 'two check readings at the same time give different offsets');
    }
  }
  const uniqueKnots = knots.filter((k, i) => i === 0 || k.timeMs !== knots[i - 1].timeMs);
  if (options.fitScale === true) return fitScale(sorted, uniqueKnots, options.minSpanHpa ?? 20);

  const method: InstrumentCorrectionMethod = uniqueKnots.length === 0 ? 'none' : uniqueKnots.length === 1 ? 'offset' : 'drift';
  const residuals = uniqueKnots.map((k, i) => {
    const others = uniqueKnots.filter((_, j) => j !== i);
    return { timeMs: k.timeMs, offsetHpa: k.offsetHpa, residualHpa: others.length === 0 ? null : k.offsetHpa - offsetAt(others, k.timeMs) };
  });
  return { method, knots: uniqueKnots, scale: null, residuals, rmsHpa: rootMeanSquare(residuals.map((r) => r.residualHpa)) };
}

/** Corrected pressure (hPa) for a chart pressure (hPa) at a UTC time (epoch ms). */
export function correctPressureHpa(correction: InstrumentCorrection, timeMs: number, chartPressureHpa: number): number {
  if (correction.scale !== null) return correction.scale.offsetHpa + correction.scale.factor * chartPressureHpa;
  if (correction.knots.length === 0) return chartPressureHpa;
  return chartPressureHpa + offsetAt(correction.knots, timeMs);
}

function fitScale(sorted: CheckReading[], knots: { timeMs: number; offsetHpa: number }[], minSpanHpa: number): InstrumentCorrection {
  const chart = sorted.map((r) => r.chartPressureHpa);
  const span = chart.length === 0 ? 0 : Math.max(...chart) - Math.min(...chart);
  if (sorted.length < 3 || span < minSpanHpa) {
    throw new InstrumentCorrectionError(
      'scale_needs_spread',
      `a scale error needs at least 3 check readings spread over ${minSpanHpa} hPa; these span ${span.toFixed(1)} hPa`,
    );
  }
  const n = sorted.length;
  const meanChart = chart.reduce((s, x) => s + x, 0) / n;
  const meanBarometer = sorted.reduce((s, r) => s + r.barometerPressureHpa, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (const r of sorted) {
    sxy += (r.chartPressureHpa - meanChart) * (r.barometerPressureHpa - meanBarometer);
    sxx += (r.chartPressureHpa - meanChart) ** 2;
  }
  const factor = sxy / sxx;
  const offsetHpa = meanBarometer - factor * meanChart;
  const residuals = sorted.map((r) => ({
    timeMs: r.timeMs,
    offsetHpa: r.barometerPressureHpa - r.chartPressureHpa,
    residualHpa: r.barometerPressureHpa - (offsetHpa + factor * r.chartPressureHpa),
  }));
  return { method: 'scale', knots, scale: { offsetHpa, factor }, residuals, rmsHpa: rootMeanSquare(residuals.map((r) => r.residualHpa)) };
}

/** Offset at a time: linear between knots, held constant beyond the ends (drift is not extrapolated). */
function offsetAt(knots: { timeMs: number; offsetHpa: number }[], timeMs: number): number {
  if (timeMs <= knots[0].timeMs) return knots[0].offsetHpa;
  const last = knots[knots.length - 1];
  if (timeMs >= last.timeMs) return last.offsetHpa;
  let i = 0;
  while (knots[i + 1].timeMs < timeMs) i++;
  const a = knots[i];
  const b = knots[i + 1];
  return a.offsetHpa + ((timeMs - a.timeMs) / (b.timeMs - a.timeMs)) * (b.offsetHpa - a.offsetHpa);
}

function rootMeanSquare(values: (number | null)[]): number {
  const present = values.filter((v): v is number => v !== null);
  return present.length === 0 ? 0 : Math.sqrt(present.reduce((s, v) => s + v * v, 0) / present.length);
}
