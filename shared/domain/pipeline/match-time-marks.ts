import type { ClockMark } from '../clock-correction';

const HOUR_MS = 3_600_000;
/** A found mark is matched to a listed one only within this much chart time (the clock error bound we accept). */
export const MARK_MATCH_HOURS = 2;

/** A time mark as given: its true instant, and its chart time when its foot on the scan is known. */
export interface GivenTimeMark {
  trueTimeMs: number;
  /** Chart time of the mark's foot (epoch ms), read through the registration; null when only the true time is known. */
  chartTimeMs: number | null;
}

/**
 * Clock marks from time marks: a mark whose foot is known is paired with its own chart time; one that has only
 * its true time takes the nearest unused found foot (chart time, epoch ms) within MARK_MATCH_HOURS.
 */
export function matchTimeMarks(given: GivenTimeMark[], foundChartTimesMs: number[]): ClockMark[] {
  const marks: ClockMark[] = [];
  const used = new Set<number>();
  for (const mark of given) {
    if (mark.chartTimeMs !== null) {
      marks.push({ chartTimeMs: mark.chartTimeMs, trueTimeMs: mark.trueTimeMs, kind: 'time_mark' });
      continue;
    }
    let best = -1;
    foundChartTimesMs.forEach((found, i) => {
      if (used.has(i) || Math.abs(found - mark.trueTimeMs) > MARK_MATCH_HOURS * HOUR_MS) return;
      if (best < 0 || Math.abs(found - mark.trueTimeMs) < Math.abs(foundChartTimesMs[best] - mark.trueTimeMs)) best = i;
    });
    if (best >= 0) {
      used.add(best);
      marks.push({ chartTimeMs: foundChartTimesMs[best], trueTimeMs: mark.trueTimeMs, kind: 'time_mark' });
    }
  }
  return marks;
}
