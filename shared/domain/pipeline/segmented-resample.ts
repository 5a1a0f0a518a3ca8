import { type RegularPoint, resampleRegular, type ResampleOptions, type TimedPressure } from '../resample';

/** A sample of the pen line with the stretch of unbroken ink it belongs to (stretches are split at flagged gaps). */
export interface StretchSample extends TimedPressure {
  stretch: number;
}

export interface StretchResampleOptions extends ResampleOptions {
  /** Regular times from here to the first sample are gaps (the follower flagged ink missing at the start). */
  gapFromMs?: number;
  /** Regular times from the last sample to here are gaps. */
  gapToMs?: number;
}

/**
 * Resamples each stretch on its own (so nothing is interpolated across a gap the ink follower flagged, however
 * short) and marks every regular time between stretches as a gap. Output sorted by time.
 */
export function resampleStretches(samples: StretchSample[], options: StretchResampleOptions): RegularPoint[] {
  const stretches = new Map<number, StretchSample[]>();
  for (const s of samples) {
    const list = stretches.get(s.stretch);
    if (list) list.push(s);
    else stretches.set(s.stretch, [s]);
  }
  const ordered = [...stretches.values()].map((list) => list.sort((a, b) => a.timeMs - b.timeMs)).sort((a, b) => a[0].timeMs - b[0].timeMs);
  const stepMs = options.stepMinutes * 60_000;
  const points: RegularPoint[] = [];
  const addGaps = (fromMs: number, toMs: number): void => {
    for (let t = Math.floor(fromMs / stepMs) * stepMs + stepMs; t < toMs; t += stepMs) {
      points.push({ timeMs: t, pressureHpa: null, flag: 'gap', uncertaintyHpa: null });
    }
  };
  if (ordered.length === 0) {
    if (options.gapFromMs !== undefined && options.gapToMs !== undefined) addGaps(options.gapFromMs - stepMs / 2, options.gapToMs);
    return points;
  }
  if (options.gapFromMs !== undefined) addGaps(Math.ceil(options.gapFromMs / stepMs) * stepMs - stepMs, ordered[0][0].timeMs);
  ordered.forEach((stretch, i) => {
    points.push(...resampleRegular(stretch, options));
    const end = stretch[stretch.length - 1].timeMs;
    const next = ordered[i + 1];
    if (next) addGaps(end, next[0].timeMs);
  });
  const last = ordered[ordered.length - 1];
  if (options.gapToMs !== undefined) addGaps(last[last.length - 1].timeMs, options.gapToMs + 1);
  // Stretches that touch (a tick-sized overlap in time) may both give a point at one time: keep the valued one.
  points.sort((a, b) => a.timeMs - b.timeMs || (a.pressureHpa === null ? 1 : 0) - (b.pressureHpa === null ? 1 : 0));
  return points.filter((p, i) => i === 0 || p.timeMs !== points[i - 1].timeMs);
}
