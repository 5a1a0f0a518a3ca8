import type { RegularPoint, TimedPressure } from '@shared/domain/resample';

/** One row of a generator truth CSV: time, true station pressure, and whether the pen drew there. */
export interface TruthRow {
  timeMs: number;
  pressureHpa: number;
  isInked: boolean;
}

/** Reads `time,pressure_hpa[,inked]` (header first). */
export function parseTruthCsv(text: string): TruthRow[] {
  const lines = text.trim().split(/\r?\n/);
  return lines.slice(1).map((line) => {
    const [time, pressure, inked] = line.split(',');
    return { timeMs: Date.parse(time), pressureHpa: Number(pressure), isInked: inked === undefined ? true : inked.trim() === '1' };
  });
}

/** Truth at a time by linear interpolation; null outside the truth's span. */
export function truthAt(truth: TruthRow[], timeMs: number): TruthRow | null {
  if (truth.length === 0 || timeMs < truth[0].timeMs || timeMs > truth[truth.length - 1].timeMs) return null;
  let low = 0;
  let high = truth.length - 1;
  while (high - low > 1) {
    const mid = (low + high) >> 1;
    if (truth[mid].timeMs <= timeMs) low = mid;
    else high = mid;
  }
  const a = truth[low];
  const b = truth[high];
  const f = b.timeMs === a.timeMs ? 0 : (timeMs - a.timeMs) / (b.timeMs - a.timeMs);
  // Only rows with weight count: a time exactly on an inked row is inked even if the next row is a pen skip.
  const isInked = (f === 1 || a.isInked) && (f === 0 || b.isInked);
  return { timeMs, pressureHpa: a.pressureHpa + f * (b.pressureHpa - a.pressureHpa), isInked };
}

export interface SeriesScore {
  /** Over points with a value that are neither off-scale nor in a pen skip of the truth. */
  rmseHpa: number;
  maxErrorHpa: number;
  comparedPoints: number;
  /** Share of series times where the pen drew that got a value. */
  inkedRecovered: number;
  /** Share of series times inside a pen skip that were flagged gap (NaN when none fell in one). */
  gapsFlagged: number;
}

/** Compares a digitized series with the truth, point by point. */
export function scoreSeries(series: RegularPoint[], truth: TruthRow[]): SeriesScore {
  let sum = 0;
  let n = 0;
  let max = 0;
  let inked = 0;
  let inkedWithValue = 0;
  let skipped = 0;
  let skippedFlagged = 0;
  for (const point of series) {
    const t = truthAt(truth, point.timeMs);
    if (t === null) continue;
    if (!t.isInked) {
      skipped++;
      if (point.flag === 'gap') skippedFlagged++;
      continue;
    }
    inked++;
    if (point.pressureHpa === null) continue;
    inkedWithValue++;
    if (point.flag === 'off_scale') continue;
    const error = point.pressureHpa - t.pressureHpa;
    sum += error * error;
    n++;
    max = Math.max(max, Math.abs(error));
  }
  return {
    rmseHpa: n > 0 ? Math.sqrt(sum / n) : NaN,
    maxErrorHpa: max,
    comparedPoints: n,
    inkedRecovered: inked > 0 ? inkedWithValue / inked : NaN,
    gapsFlagged: skipped > 0 ? skippedFlagged / skipped : NaN,
  };
}

/**
 * Time of the steepest rise within ±windowMs of a time, from dense samples (a pressure jump's time on the
 * line); null when no samples are there.
 */
export function steepestRiseTimeMs(samples: TimedPressure[], aroundMs: number, windowMs: number): number | null {
  let best = -Infinity;
  let at: number | null = null;
  for (let i = 1; i < samples.length; i++) {
    const a = samples[i - 1];
    const b = samples[i];
    if (b.timeMs < aroundMs - windowMs || a.timeMs > aroundMs + windowMs) continue;
    // Rise over a short window of 15 minutes, so the two points a vertical stroke gives do not divide by zero.
    let j = i;
    while (j < samples.length - 1 && samples[j].timeMs - a.timeMs < 15 * 60_000) j++;
    const rise = samples[j].pressureHpa - a.pressureHpa;
    if (rise > best) {
      best = rise;
      // The jump's time: where the line crosses the middle of that rise.
      const middle = a.pressureHpa + rise / 2;
      let k = i - 1;
      while (k < j && samples[k + 1].pressureHpa < middle) k++;
      at = samples[Math.min(k + 1, j)].timeMs;
    }
  }
  return at;
}

/**
 * When the line crosses `levelHpa` in the given direction (+1 rising, −1 falling), by linear interpolation
 * between samples: the crossing nearest `aroundMs` within ±windowMs; null when the line does not cross there.
 * For a pressure jump the level is the truth's at the jump's middle, so this is the jump's time on the line.
 */
export function crossingTimeMs(samples: TimedPressure[], levelHpa: number, direction: 1 | -1, aroundMs: number, windowMs: number): number | null {
  let best: number | null = null;
  for (let i = 1; i < samples.length; i++) {
    const a = samples[i - 1];
    const b = samples[i];
    if (b.timeMs < aroundMs - windowMs || a.timeMs > aroundMs + windowMs) continue;
    const da = direction * (a.pressureHpa - levelHpa);
    const db = direction * (b.pressureHpa - levelHpa);
    if (!(da < 0 && db >= 0)) continue;
    const at = b.timeMs === a.timeMs ? a.timeMs : a.timeMs + ((b.timeMs - a.timeMs) * -da) / (db - da);
    if (best === null || Math.abs(at - aroundMs) < Math.abs(best - aroundMs)) best = at;
  }
  return best;
}

export interface WindowError {
  rmsHpa: number;
  maxErrorHpa: number;
  /** Times of the regular grid that fell on the line (not in a gap). */
  compared: number;
  /** Times of the regular grid in the window. */
  asked: number;
}

/**
 * The line against an exact truth on a regular grid of `stepMs` over [fromMs, toMs], as a series at that step
 * would give it (linear between samples). A grid time counts only where the samples around it are at most
 * `maxSpacingMs` apart (elsewhere the series would show a gap).
 */
export function windowError(
  samples: TimedPressure[],
  truthHpaAt: (timeMs: number) => number,
  fromMs: number,
  toMs: number,
  stepMs: number,
  maxSpacingMs = 30 * 60_000,
): WindowError {
  let sum = 0;
  let max = 0;
  let compared = 0;
  let asked = 0;
  let i = 0;
  for (let t = fromMs; t <= toMs; t += stepMs) {
    asked++;
    while (i < samples.length - 2 && samples[i + 1].timeMs < t) i++;
    const a = samples[i];
    const b = samples[i + 1];
    if (a === undefined || b === undefined || a.timeMs > t || b.timeMs < t || b.timeMs - a.timeMs > maxSpacingMs) continue;
    const f = b.timeMs === a.timeMs ? 0 : (t - a.timeMs) / (b.timeMs - a.timeMs);
    const error = a.pressureHpa + f * (b.pressureHpa - a.pressureHpa) - truthHpaAt(t);
    sum += error * error;
    max = Math.max(max, Math.abs(error));
    compared++;
  }
  return { rmsHpa: compared > 0 ? Math.sqrt(sum / compared) : NaN, maxErrorHpa: max, compared, asked };
}
