import type { PressureAtTime } from './pressure-tendency';

/**
 * Front passage candidates in a pressure series, as suggestions for a person to confirm: a pressure minimum
 * followed by a sustained rise (pressure usually falls ahead of a front and rises behind it, the front lying in
 * the trough), and a sudden rise (pressure jump, as with a squall line). The semidiurnal tide (~1 hPa, from
 * memory) can make minima of its own; the default thresholds sit above it, but a person decides.
 */

/** 'front': a minimum followed by a sustained rise; 'pressure_jump': a sudden rise. */
export type FrontCandidateKind = 'front' | 'pressure_jump';

/**
 * A suggestion. front: timeMs of the minimum, depthHpa below the lower of its two shoulders, rateHpaPerHour the
 * mean rise over the rise window. pressure_jump: timeMs of the foot of the rise, depthHpa the size of the rise,
 * rateHpaPerHour its steepest rate over the jump window.
 */
export interface FrontCandidate {
  timeMs: number;
  kind: FrontCandidateKind;
  depthHpa: number;
  rateHpaPerHour: number;
}

/** Thresholds; hours, minutes and hPa as named. */
export interface FrontCandidateOptions {
  /** The minimum must be the lowest within ± this (default 6 h); its shoulders are taken over the same span. */
  troughWindowHours?: number;
  /** Least depth below the lower shoulder (default 1.0 hPa, our choice). */
  minDepthHpa?: number;
  /** Span of the sustained rise after the minimum (default 3 h). */
  riseHours?: number;
  /** Least rise over riseHours (default 1.6 hPa: "rising" in the Met Office 3-hour terms, docs/references.md §5). */
  minRiseHpa?: number;
  /** Largest dip allowed inside a sustained rise (default 0.2 hPa, our choice). */
  maxDipHpa?: number;
  /** Jump window (default 60 min). */
  jumpMinutes?: number;
  /** Least rise rate for a jump (default 2.0 hPa/h ≈ 0.06 inHg/h, the PRESRR threshold, docs/references.md §5). */
  jumpRateHpaPerHour?: number;
  /** Samples further apart than this break the series (default 90 min). */
  maxGapMinutes?: number;
}

const HOUR_MS = 3_600_000;

type Valued = { timeMs: number; pressureHpa: number };

/** Finds front and pressure-jump candidates in a series (any order; nulls are gaps), sorted by time. */
export function findFrontCandidates(points: PressureAtTime[], options: FrontCandidateOptions = {}): FrontCandidate[] {
  const segments = splitSegments(points, (options.maxGapMinutes ?? 90) * 60_000);
  const candidates = segments.flatMap((segment) => [...findFronts(segment, options), ...findJumps(segment, options)]);
  return candidates.sort((a, b) => a.timeMs - b.timeMs || a.kind.localeCompare(b.kind));
}

function findFronts(segment: Valued[], options: FrontCandidateOptions): FrontCandidate[] {
  const windowMs = (options.troughWindowHours ?? 6) * HOUR_MS;
  const minDepth = options.minDepthHpa ?? 1.0;
  const riseMs = (options.riseHours ?? 3) * HOUR_MS;
  const minRise = options.minRiseHpa ?? 1.6;
  const maxDip = options.maxDipHpa ?? 0.2;
  const found: FrontCandidate[] = [];
  for (let i = 0; i < segment.length; i++) {
    const { timeMs, pressureHpa } = segment[i];
    const before = segment.filter((s) => s.timeMs >= timeMs - windowMs && s.timeMs < timeMs);
    const after = segment.filter((s) => s.timeMs > timeMs && s.timeMs <= timeMs + windowMs);
    // The first of equal lowest points is the minimum; needs both shoulders and the rise window inside the data.
    if (before.length === 0 || after.length === 0 || segment[segment.length - 1].timeMs < timeMs + riseMs) continue;
    if (before.some((s) => s.pressureHpa <= pressureHpa) || after.some((s) => s.pressureHpa < pressureHpa)) continue;
    const depth = Math.min(Math.max(...before.map((s) => s.pressureHpa)), Math.max(...after.map((s) => s.pressureHpa))) - pressureHpa;
    const rise = segment.filter((s) => s.timeMs > timeMs && s.timeMs <= timeMs + riseMs);
    const riseEnd = interpolate(segment, timeMs + riseMs);
    if (depth < minDepth || riseEnd === null || riseEnd - pressureHpa < minRise || !isSustained(rise, maxDip)) continue;
    found.push({ timeMs, kind: 'front', depthHpa: depth, rateHpaPerHour: (riseEnd - pressureHpa) / (riseMs / HOUR_MS) });
  }
  return found;
}

/** A rise is sustained when it never drops more than maxDip below its running maximum. */
function isSustained(rise: Valued[], maxDip: number): boolean {
  let runningMax = Number.NEGATIVE_INFINITY;
  for (const s of rise) {
    runningMax = Math.max(runningMax, s.pressureHpa);
    if (runningMax - s.pressureHpa > maxDip) return false;
  }
  return true;
}

function findJumps(segment: Valued[], options: FrontCandidateOptions): FrontCandidate[] {
  const windowMs = (options.jumpMinutes ?? 60) * 60_000;
  const minRate = options.jumpRateHpaPerHour ?? 2.0;
  const threshold = (minRate * windowMs) / HOUR_MS;
  const events: { startIndex: number; endIndex: number; rate: number }[] = [];
  for (let i = 0; i < segment.length; i++) {
    let bestJ = -1;
    let bestRise = 0;
    for (let j = i + 1; j < segment.length && segment[j].timeMs - segment[i].timeMs <= windowMs; j++) {
      const rise = segment[j].pressureHpa - segment[i].pressureHpa;
      if (rise > bestRise) {
        bestRise = rise;
        bestJ = j;
      }
    }
    if (bestJ < 0 || bestRise < threshold) continue;
    const rate = bestRise / (windowMs / HOUR_MS);
    const last = events[events.length - 1];
    // Overlapping windows belong to one jump.
    if (last !== undefined && i <= last.endIndex) {
      last.endIndex = Math.max(last.endIndex, bestJ);
      last.rate = Math.max(last.rate, rate);
    } else {
      events.push({ startIndex: i, endIndex: bestJ, rate });
    }
  }
  return events.map(({ startIndex, endIndex, rate }) => {
    // The foot is the lowest point at the start of the event; the size is the rise from it to the event's top.
    const span = segment.slice(startIndex, endIndex + 1);
    let footIndex = 0;
    span.forEach((s, k) => {
      if (s.pressureHpa < span[footIndex].pressureHpa && k < span.length - 1) footIndex = k;
    });
    const top = Math.max(...span.slice(footIndex).map((s) => s.pressureHpa));
    return { timeMs: span[footIndex].timeMs, kind: 'pressure_jump' as const, depthHpa: top - span[footIndex].pressureHpa, rateHpaPerHour: rate };
  });
}

function splitSegments(points: PressureAtTime[], maxGapMs: number): Valued[][] {
  const sorted = points.slice().sort((a, b) => a.timeMs - b.timeMs);
  const segments: Valued[][] = [];
  let current: Valued[] = [];
  for (const p of sorted) {
    if (p.pressureHpa === null || !Number.isFinite(p.pressureHpa)) {
      if (current.length > 0) segments.push(current);
      current = [];
      continue;
    }
    if (current.length > 0 && p.timeMs - current[current.length - 1].timeMs > maxGapMs) {
      segments.push(current);
      current = [];
    }
    current.push({ timeMs: p.timeMs, pressureHpa: p.pressureHpa });
  }
  if (current.length > 0) segments.push(current);
  return segments;
}

function interpolate(segment: Valued[], timeMs: number): number | null {
  for (let i = 1; i < segment.length; i++) {
    if (segment[i].timeMs >= timeMs && segment[i - 1].timeMs <= timeMs) {
      const a = segment[i - 1];
      const b = segment[i];
      return b.timeMs === a.timeMs ? b.pressureHpa : a.pressureHpa + ((timeMs - a.timeMs) / (b.timeMs - a.timeMs)) * (b.pressureHpa - a.pressureHpa);
    }
  }
  return null;
}
