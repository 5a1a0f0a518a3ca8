import type { PressureAtTime } from './pressure-tendency';

/** A fall (negative) or rise (positive) of pressure between two times: hPa, and hPa per hour over the span. */
export interface PressureChange {
  fromMs: number;
  toMs: number;
  changeHpa: number;
  rateHpaPerHour: number;
}

const HOUR_MS = 3_600_000;

/**
 * The change p(toMs) − p(fromMs), each end linearly interpolated between its bracketing samples (any order, nulls
 * are gaps), and its mean rate per hour. Null when toMs ≤ fromMs or an end is not known: outside the samples, in a
 * gap, or between samples further apart than maxGapMinutes (default 90, as the tendency).
 */
export function pressureChange(samples: PressureAtTime[], fromMs: number, toMs: number, maxGapMinutes = 90): PressureChange | null {
  if (!(toMs > fromMs)) return null;
  const sorted = samples.slice().sort((a, b) => a.timeMs - b.timeMs);
  const start = valueAt(sorted, fromMs, maxGapMinutes * 60_000);
  const end = valueAt(sorted, toMs, maxGapMinutes * 60_000);
  if (start === null || end === null) return null;
  const changeHpa = end - start;
  return { fromMs, toMs, changeHpa, rateHpaPerHour: changeHpa / ((toMs - fromMs) / HOUR_MS) };
}

function valueAt(sorted: PressureAtTime[], timeMs: number, maxGapMs: number): number | null {
  for (let i = 0; i < sorted.length; i++) {
    const b = sorted[i];
    if (b.timeMs === timeMs) return b.pressureHpa;
    if (b.timeMs > timeMs) {
      const a = sorted[i - 1];
      if (a === undefined || a.pressureHpa === null || b.pressureHpa === null || b.timeMs - a.timeMs > maxGapMs) return null;
      return a.pressureHpa + ((timeMs - a.timeMs) / (b.timeMs - a.timeMs)) * (b.pressureHpa - a.pressureHpa);
    }
  }
  return null;
}
