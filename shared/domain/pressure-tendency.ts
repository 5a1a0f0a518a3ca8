/**
 * Three-hour pressure tendency at station level: its amount (ppp, tenths of hPa, no sign) and its characteristic
 * a (WMO-No. 306, Manual on Codes, Vol. I.1, code table 0200), as reported in the SYNOP group 5appp.
 */

/** Characteristic of pressure tendency, WMO-No. 306 code table 0200 (0–8). */
export type TendencyCharacteristic = 0 | 1 | 2 | 3 | 4 | 5 | 6 | 7 | 8;

/** A pressure at a time: UTC epoch ms, hPa (null in a gap). RegularPoint fits. */
export interface PressureAtTime {
  timeMs: number;
  pressureHpa: number | null;
}

/**
 * The tendency over the three hours before observationTimeMs. amountHpa: signed net change p(t) − p(t − 3 h);
 * ppp: |amount| in tenths of hPa, 0–999; characteristic: code table 0200; group: '5appp'.
 */
export interface PressureTendency {
  observationTimeMs: number;
  amountHpa: number;
  ppp: number;
  characteristic: TendencyCharacteristic;
  group: string;
}

/**
 * Options, hPa. steadyHpa (default 0.1): a half-period change at most this is "steady", after the Met Office
 * "steady" term (< 0.1 hPa in 3 h). rateChangeHpa (default 0.2): halves differing by more than this rise or fall
 * "more slowly" / "more rapidly" (our choice; the code table gives no number). maxGapMinutes (default 90).
 */
export interface TendencyOptions {
  steadyHpa?: number;
  rateChangeHpa?: number;
  maxGapMinutes?: number;
}

const THREE_HOURS_MS = 3 * 3_600_000;

/**
 * Computes the three-hour tendency ending at observationTimeMs from pressures in any order, or null when the
 * curve is not known at t − 3 h, t − 1.5 h and t (samples further apart than maxGapMinutes leave it unknown).
 */
export function threeHourTendency(samples: PressureAtTime[], observationTimeMs: number, options: TendencyOptions = {}): PressureTendency | null {
  const steady = options.steadyHpa ?? 0.1;
  const rateChange = options.rateChangeHpa ?? 0.2;
  const maxGapMs = (options.maxGapMinutes ?? 90) * 60_000;
  const valued = samples
    .filter((s): s is { timeMs: number; pressureHpa: number } => s.pressureHpa !== null && Number.isFinite(s.pressureHpa))
    .sort((a, b) => a.timeMs - b.timeMs);
  const startMs = observationTimeMs - THREE_HOURS_MS;
  const p0 = valueAt(valued, startMs, maxGapMs);
  const pm = valueAt(valued, startMs + THREE_HOURS_MS / 2, maxGapMs);
  const p3 = valueAt(valued, observationTimeMs, maxGapMs);
  if (p0 === null || pm === null || p3 === null) return null;

  const amountHpa = p3 - p0;
  // A tiny epsilon keeps 1.6 from becoming 15.999… tenths.
  const ppp = Math.min(999, Math.round(Math.abs(amountHpa) * 10 + 1e-9));
  const interior = [pm, ...valued.filter((s) => s.timeMs > startMs && s.timeMs < observationTimeMs).map((s) => s.pressureHpa)];
  const characteristic = classify(p0, pm, p3, Math.max(...interior), Math.min(...interior), ppp === 0, steady, rateChange);
  return { observationTimeMs, amountHpa, ppp, characteristic, group: `5${characteristic}${String(ppp).padStart(3, '0')}` };
}

function classify(p0: number, pm: number, p3: number, max: number, min: number, isSame: boolean, steady: number, rateChange: number): TendencyCharacteristic {
  const net = p3 - p0;
  const riseThenFall = max - p0 > steady && max - p3 > steady;
  const fallThenRise = p0 - min > steady && p3 - min > steady;
  const peakExcursion = Math.min(max - p0, max - p3);
  const troughExcursion = Math.min(p0 - min, p3 - min);
  if (riseThenFall && (!fallThenRise || peakExcursion >= troughExcursion)) {
    // 0: increasing, then decreasing, now the same or higher; 8: … now lower.
    return isSame || net > 0 ? 0 : 8;
  }
  if (fallThenRise) {
    // 5: decreasing, then increasing, now the same or lower; 3: … now higher.
    return isSame || net < 0 ? 5 : 3;
  }
  if (isSame) return 4;
  const d1 = pm - p0;
  const d2 = p3 - pm;
  const isFirstSteady = Math.abs(d1) <= steady;
  const isSecondSteady = Math.abs(d2) <= steady;
  if (net > 0) {
    if (isFirstSteady && isSecondSteady) return 2;
    if (d1 <= steady) return 3; // steady (or decreasing), then increasing
    if (d2 <= steady) return 1; // increasing, then steady
    if (d1 - d2 > rateChange) return 1; // increasing, then increasing more slowly
    if (d2 - d1 > rateChange) return 3; // increasing, then increasing more rapidly
    return 2;
  }
  if (isFirstSteady && isSecondSteady) return 7;
  if (d1 >= -steady) return 8; // steady (or increasing), then decreasing
  if (d2 >= -steady) return 6; // decreasing, then steady
  if (d2 - d1 > rateChange) return 6; // decreasing, then decreasing more slowly
  if (d1 - d2 > rateChange) return 8; // decreasing, then decreasing more rapidly
  return 7;
}

/** Linear interpolation between the bracketing samples, or null when they are missing or too far apart. */
function valueAt(sorted: { timeMs: number; pressureHpa: number }[], timeMs: number, maxGapMs: number): number | null {
  for (let i = 0; i < sorted.length; i++) {
    if (sorted[i].timeMs === timeMs) return sorted[i].pressureHpa;
    if (sorted[i].timeMs > timeMs) {
      if (i === 0) return null;
      const a = sorted[i - 1];
      const b = sorted[i];
      if (b.timeMs - a.timeMs > maxGapMs) return null;
      return a.pressureHpa + ((timeMs - a.timeMs) / (b.timeMs - a.timeMs)) * (b.pressureHpa - a.pressureHpa);
    }
  }
  return null;
}
