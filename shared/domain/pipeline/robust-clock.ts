import { type ClockCorrection, ClockCorrectionError, type ClockMark, fitClockCorrection } from '../clock-correction';

/** A mark the others contradict by more than this is taken as misread (a steep stretch of line, not a mark). */
export const MARK_OUTLIER_MINUTES = 12;

/** The clock fit and the marks it left out as contradicting the others. */
export interface RobustClockFit {
  clock: ClockCorrection | null;
  /** Chart times (epoch ms) of the marks dropped as outliers, worst first. */
  droppedChartTimesMs: number[];
}

/**
 * Clock correction that survives a misread mark: marks that put time backwards, or that the others contradict
 * by more than MARK_OUTLIER_MINUTES (leave-one-out), are dropped one at a time, worst first; three are always kept.
 */
export function fitRobustClock(marks: ClockMark[]): RobustClockFit {
  let kept = [...marks];
  const dropped: number[] = [];
  while (kept.length > 0) {
    let fit: ClockCorrection;
    try {
      fit = fitClockCorrection(kept);
    } catch (error) {
      // Contradictory marks: drop the one whose offset is furthest from the median offset, and try again.
      if (!(error instanceof ClockCorrectionError) || kept.length <= 1) throw error;
      const furthest = furthestOffset(kept);
      dropped.push(furthest.chartTimeMs);
      kept = kept.filter((m) => m !== furthest);
      continue;
    }
    let worst = -1;
    let worstMinutes = MARK_OUTLIER_MINUTES;
    fit.residuals.forEach((r, i) => {
      if (r.leaveOneOutMinutes !== null && Math.abs(r.leaveOneOutMinutes) > worstMinutes) {
        worstMinutes = Math.abs(r.leaveOneOutMinutes);
        worst = i;
      }
    });
    if (worst < 0 || kept.length <= 3) return { clock: fit, droppedChartTimesMs: dropped };
    const dropChartMs = fit.residuals[worst].chartTimeMs;
    dropped.push(dropChartMs);
    kept = kept.filter((m) => m.chartTimeMs !== dropChartMs);
  }
  return { clock: null, droppedChartTimesMs: dropped };
}

function furthestOffset(marks: ClockMark[]): ClockMark {
  const offsets = marks.map((m) => m.trueTimeMs - m.chartTimeMs);
  const middle = [...offsets].sort((a, b) => a - b)[offsets.length >> 1];
  let furthest = 0;
  offsets.forEach((o, i) => {
    if (Math.abs(o - middle) > Math.abs(offsets[furthest] - middle)) furthest = i;
  });
  return marks[furthest];
}
