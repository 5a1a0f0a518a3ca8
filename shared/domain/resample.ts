import type { SeriesFlag } from '../api/series';

/** Re-exported from shared/api/series.ts: 'ok' | 'interpolated' | 'gap' | 'off_scale' | 'suspect'. */
export type { SeriesFlag };

/** One pressure sample along an ink line: UTC epoch ms, hPa, optional confidence 0–1 and off-scale mark. */
export interface TimedPressure {
  timeMs: number;
  pressureHpa: number;
  confidence?: number;
  isOffScale?: boolean;
  /** The span from this sample to the next is a bridge (the ink line joined across a gap on purpose). */
  bridgesToNext?: boolean;
}

/** One point of a regular series: exact clock time (epoch ms), hPa or null in a gap, quality flag, uncertainty hPa or null. */
export interface RegularPoint {
  timeMs: number;
  pressureHpa: number | null;
  flag: SeriesFlag;
  uncertaintyHpa: number | null;
}

/** Options of resampleRegular; all spans in minutes (> 0). */
export interface ResampleOptions {
  /** Series step: 60 for hourly, 10 for ten-minute points. Points fall on multiples of it from the UTC epoch. */
  stepMinutes: number;
  /** Bracketing samples further apart than this leave a gap. */
  maxGapMinutes: number;
  /** Uncertainty given to every point with a value (hPa ≥ 0); null uncertainty when omitted. */
  baseUncertaintyHpa?: number;
  /** Bracketing samples at most this far apart are ordinary ink ('ok'); further (up to maxGapMinutes) is a bridged span ('interpolated'). Default stepMinutes. */
  maxOkSpanMinutes?: number;
  /** Samples whose confidence is below this (0–1) make their points 'suspect'. Default 0.5. */
  minConfidence?: number;
}

const MS_PER_MINUTE = 60_000;

/**
 * Resamples ink-line samples (any order) to exact clock times within their span, by linear interpolation
 * between the bracketing samples. A point is 'interpolated' when its bracketing span is a bridge or longer than
 * maxOkSpanMinutes. Flag precedence: gap > off_scale > suspect > interpolated > ok.
 */
export function resampleRegular(samples: TimedPressure[], options: ResampleOptions): RegularPoint[] {
  const { stepMinutes, maxGapMinutes } = options;
  if (!(stepMinutes > 0) || !(maxGapMinutes >= 0)) throw new RangeError('stepMinutes must be positive and maxGapMinutes not negative');
  const stepMs = stepMinutes * MS_PER_MINUTE;
  const maxGapMs = maxGapMinutes * MS_PER_MINUTE;
  const maxOkSpanMs = (options.maxOkSpanMinutes ?? stepMinutes) * MS_PER_MINUTE;
  const minConfidence = options.minConfidence ?? 0.5;
  const uncertaintyHpa = options.baseUncertaintyHpa ?? null;
  const sorted = samples
    .filter((s) => Number.isFinite(s.timeMs) && Number.isFinite(s.pressureHpa))
    .sort((a, b) => a.timeMs - b.timeMs);
  if (sorted.length === 0) return [];

  const isSuspect = (s: TimedPressure) => s.confidence !== undefined && s.confidence < minConfidence;
  const points: RegularPoint[] = [];
  const firstMs = Math.ceil(sorted[0].timeMs / stepMs) * stepMs;
  const lastMs = sorted[sorted.length - 1].timeMs;
  let i = 0;
  for (let timeMs = firstMs; timeMs <= lastMs; timeMs += stepMs) {
    while (i < sorted.length - 2 && sorted[i + 1].timeMs < timeMs) i++;
    const before = sorted[i];
    const after = sorted[Math.min(i + 1, sorted.length - 1)];
    // A point on a sample takes that sample alone, even if its neighbours are far away.
    const exact = before.timeMs === timeMs ? before : after.timeMs === timeMs ? after : null;
    if (exact !== null) {
      points.push({ timeMs, pressureHpa: exact.pressureHpa, ...flagFor([exact], false) });
      continue;
    }
    const spanMs = after.timeMs - before.timeMs;
    if (spanMs > maxGapMs) {
      points.push({ timeMs, pressureHpa: null, flag: 'gap', uncertaintyHpa: null });
      continue;
    }
    const weight = (timeMs - before.timeMs) / spanMs;
    const pressureHpa = before.pressureHpa + weight * (after.pressureHpa - before.pressureHpa);
    points.push({ timeMs, pressureHpa, ...flagFor([before, after], before.bridgesToNext === true || spanMs > maxOkSpanMs) });
  }
  return points;

  function flagFor(used: TimedPressure[], isBridged: boolean): Pick<RegularPoint, 'flag' | 'uncertaintyHpa'> {
    // Off the printed scale the pen rests on the edge: the value is a bound, so no uncertainty is claimed.
    if (used.some((s) => s.isOffScale === true)) return { flag: 'off_scale', uncertaintyHpa: null };
    if (used.some(isSuspect)) return { flag: 'suspect', uncertaintyHpa };
    return { flag: isBridged ? 'interpolated' : 'ok', uncertaintyHpa };
  }
}
