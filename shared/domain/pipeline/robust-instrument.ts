import { type CheckReading, fitInstrumentCorrection, type InstrumentCorrection } from '../instrument-correction';
import type { StretchSample } from './segmented-resample';

/** A check reading the others contradict by more than this is taken as misread or mistyped, hPa. */
export const CHECK_OUTLIER_HPA = 1.5;
/** Lines fitted before and after a check reading must agree this well for the reading to be used, hPa. */
const CHECK_SIDES_AGREE_HPA = 0.5;

/** A barometer reading at a true instant (UTC epoch ms), station hPa. */
export interface TimedBarometerReading {
  timeMs: number;
  pressureHpa: number;
}

/** Why a check reading was not used, or that it was. */
export type CheckReadingUse = 'used' | 'no_line' | 'outlier';

export interface RobustInstrumentFit {
  instrument: InstrumentCorrection | null;
  /** One entry per given reading, in the given order. */
  uses: CheckReadingUse[];
}

/**
 * Instrument correction from check readings that fall on good ink (not in a gap, not off the scale); readings
 * the others contradict by more than CHECK_OUTLIER_HPA are dropped one at a time, worst first (two are kept).
 */
export function fitRobustInstrument(checks: TimedBarometerReading[], samples: StretchSample[]): RobustInstrumentFit {
  const uses: CheckReadingUse[] = checks.map(() => 'no_line');
  const readings: (CheckReading & { index: number })[] = [];
  checks.forEach((check, index) => {
    const chartPressureHpa = linePressureAt(samples, check.timeMs);
    if (chartPressureHpa !== null) readings.push({ timeMs: check.timeMs, chartPressureHpa, barometerPressureHpa: check.pressureHpa, index });
  });
  let kept = readings;
  while (kept.length > 0) {
    const fit = fitInstrumentCorrection(kept);
    const isContradicted = fit.residuals.some((r) => r.residualHpa !== null && Math.abs(r.residualHpa) > CHECK_OUTLIER_HPA);
    if (!isContradicted || kept.length <= 2) {
      for (const r of kept) uses[r.index] = 'used';
      return { instrument: fit, uses };
    }
    // A wrong reading also spoils its neighbours' leave-one-out residuals, so the one dropped is the reading whose
    // removal leaves the others agreeing best (smallest RMS of their residuals).
    const drop = kept.reduce((best, candidate) => (rmsWithout(kept, candidate) < rmsWithout(kept, best) ? candidate : best));
    uses[drop.index] = 'outlier';
    kept = kept.filter((r) => r !== drop);
  }
  return { instrument: null, uses };
}

function rmsWithout(readings: CheckReading[], left: CheckReading): number {
  return fitInstrumentCorrection(readings.filter((r) => r !== left)).rmsHpa;
}

/**
 * The line's pressure at a check reading's time. The observer usually makes a time mark while reading the
 * barometer, so the few minutes around the time are left out: a straight line is fitted to the samples 6–40
 * minutes either side (same stretch, not off-scale; at least one on each side, two when the line is dense).
 */
export function linePressureAt(samples: StretchSample[], timeMs: number): number | null {
  const near = 6 * 60_000;
  const far = 40 * 60_000;
  let low = 0;
  let high = samples.length;
  while (low < high) {
    const mid = (low + high) >> 1;
    if (samples[mid].timeMs < timeMs - far) low = mid + 1;
    else high = mid;
  }
  const used: StretchSample[] = [];
  for (let i = low; i < samples.length && samples[i].timeMs <= timeMs + far; i++) {
    const s = samples[i];
    if (!s.isOffScale && Math.abs(s.timeMs - timeMs) >= near) used.push(s);
  }
  let before = used.filter((s) => s.timeMs < timeMs);
  let after = used.filter((s) => s.timeMs > timeMs);
  if (before.length < 2 || after.length < 2) {
    // Sparse hand-placed knots: the bracketing knots either side, wherever they are, on one stretch.
    const prev = lastBefore(samples, timeMs);
    const next = prev + 1;
    if (prev < 0 || next >= samples.length || samples[prev].isOffScale || samples[next].isOffScale) return null;
    if (samples[prev].stretch !== samples[next].stretch) return null;
    before = [samples[prev]];
    after = [samples[next]];
    const span = samples[next].timeMs - samples[prev].timeMs;
    if (span <= 0) return samples[prev].pressureHpa;
    const share = (timeMs - samples[prev].timeMs) / span;
    return samples[prev].pressureHpa + share * (samples[next].pressureHpa - samples[prev].pressureHpa);
  }
  if (before[before.length - 1].stretch !== after[0].stretch) return null;
  const fromBefore = lineAt(before, timeMs);
  const fromAfter = lineAt(after, timeMs);
  // The two sides disagree: the pressure jumped (or the line is misread) right at the reading; it cannot check the chart.
  if (Math.abs(fromBefore - fromAfter) > CHECK_SIDES_AGREE_HPA) return null;
  return lineAt([...before, ...after], timeMs);
}

function lastBefore(samples: StretchSample[], timeMs: number): number {
  let low = 0;
  let high = samples.length;
  while (low < high) {
    const mid = (low + high) >> 1;
    if (samples[mid].timeMs <= timeMs) low = mid + 1;
    else high = mid;
  }
  return low - 1;
}

/** Least-squares straight line through the samples, evaluated at timeMs. */
function lineAt(samples: StretchSample[], timeMs: number): number {
  const meanT = samples.reduce((sum, s) => sum + (s.timeMs - timeMs), 0) / samples.length;
  const meanP = samples.reduce((sum, s) => sum + s.pressureHpa, 0) / samples.length;
  let sxx = 0;
  let sxy = 0;
  for (const s of samples) {
    const dt = s.timeMs - timeMs - meanT;
    sxx += dt * dt;
    sxy += dt * (s.pressureHpa - meanP);
  }
  const slope = sxx > 0 ? sxy / sxx : 0;
  return meanP - slope * meanT;
}
