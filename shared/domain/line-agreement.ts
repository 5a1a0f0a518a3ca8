/** One hourly point of an ink line's series: UTC epoch ms, hPa and its standard uncertainty (hPa, 1σ; null when unknown). */
export interface AgreementPoint {
  timeMs: number;
  pressureHpa: number;
  uncertaintyHpa: number | null;
}

/** How two independent lines of one chart agree over the times both have. */
export interface LineAgreement {
  commonPointCount: number;
  /** √(mean d²) of the differences d = b − a at the common times, hPa; null below two common times. */
  rmsHpa: number | null;
  maxDifferenceHpa: number | null;
  /** The shift of line b, minutes, within ±maxOffsetMinutes that gives the smallest RMS (0 when none beats it). */
  bestOffsetMinutes: number | null;
  /** Common times where |d| > k·√(u_a² + u_b²). */
  disagreeingPointCount: number;
}

export interface AgreementOptions {
  /** Coverage factor k of the disagreement test (default 2). */
  coverageFactor?: number;
  /** Stands in for a missing uncertainty, hPa (default 0.5). */
  defaultUncertaintyHpa?: number;
  /** Shifts tried for the best offset: ±maxOffsetMinutes in steps of offsetStepMinutes (defaults 180 and 10). */
  maxOffsetMinutes?: number;
  offsetStepMinutes?: number;
}

const MS_PER_MINUTE = 60_000;

/** b's pressure at a time by linear interpolation between its two neighbouring points (null outside b or across a gap). */
function interpolate(points: readonly AgreementPoint[], timeMs: number, maxGapMs: number): number | null {
  let low = 0;
  let high = points.length - 1;
  if (points.length === 0 || timeMs < points[0].timeMs || timeMs > points[high].timeMs) return null;
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if (points[middle].timeMs <= timeMs) low = middle;
    else high = middle;
  }
  const before = points[low];
  const after = points[high];
  if (before.timeMs === timeMs) return before.pressureHpa;
  if (after.timeMs === timeMs) return after.pressureHpa;
  if (after.timeMs - before.timeMs > maxGapMs) return null;
  const share = (timeMs - before.timeMs) / (after.timeMs - before.timeMs);
  return before.pressureHpa + share * (after.pressureHpa - before.pressureHpa);
}

function rmsOf(differences: readonly number[]): number | null {
  if (differences.length < 2) return null;
  return Math.sqrt(differences.reduce((sum, d) => sum + d * d, 0) / differences.length);
}

/**
 * Compares two ink lines of the same chart (both in time order). RMS and largest difference are taken at the
 * times both lines have; the best offset is the shift of b (read by linear interpolation) that minimises the
 * RMS, so a line read against a mis-set time mark shows up as an offset rather than as noise.
 */
export function compareLines(a: readonly AgreementPoint[], b: readonly AgreementPoint[], options: AgreementOptions = {}): LineAgreement {
  const coverageFactor = options.coverageFactor ?? 2;
  const defaultUncertaintyHpa = options.defaultUncertaintyHpa ?? 0.5;
  const maxOffsetMinutes = options.maxOffsetMinutes ?? 180;
  const stepMinutes = options.offsetStepMinutes ?? 10;
  const byTime = new Map(b.map((point) => [point.timeMs, point]));
  const differences: number[] = [];
  let disagreeingPointCount = 0;
  for (const point of a) {
    const other = byTime.get(point.timeMs);
    if (!other) continue;
    const difference = other.pressureHpa - point.pressureHpa;
    differences.push(difference);
    const combined = Math.hypot(point.uncertaintyHpa ?? defaultUncertaintyHpa, other.uncertaintyHpa ?? defaultUncertaintyHpa);
    if (Math.abs(difference) > coverageFactor * combined) disagreeingPointCount += 1;
  }
  const rmsHpa = rmsOf(differences);
  if (rmsHpa === null) {
    return { commonPointCount: differences.length, rmsHpa: null, maxDifferenceHpa: null, bestOffsetMinutes: null, disagreeingPointCount };
  }
  // Hourly series with gaps of more than three hours left out (ink-line-reading.ts): do not bridge those.
  const maxGapMs = 3 * 60 * MS_PER_MINUTE;
  let bestOffsetMinutes = 0;
  let bestRms = rmsHpa;
  for (let offset = -maxOffsetMinutes; offset <= maxOffsetMinutes; offset += stepMinutes) {
    if (offset === 0) continue;
    const shifted: number[] = [];
    for (const point of a) {
      // b shifted by `offset` minutes later: b's reading at t + offset stands for a's at t.
      const value = interpolate(b, point.timeMs + offset * MS_PER_MINUTE, maxGapMs);
      if (value !== null) shifted.push(value - point.pressureHpa);
    }
    // Compare only shifts that keep most of the common span, so a tiny overlap cannot win by luck.
    if (shifted.length < Math.max(2, Math.ceil(0.8 * differences.length))) continue;
    const rms = rmsOf(shifted);
    if (rms !== null && rms < bestRms - 1e-9) {
      bestRms = rms;
      bestOffsetMinutes = offset;
    }
  }
  return {
    commonPointCount: differences.length,
    rmsHpa,
    maxDifferenceHpa: Math.max(...differences.map(Math.abs)),
    bestOffsetMinutes,
    disagreeingPointCount,
  };
}
