import type { StoredPointView } from '@shared/api/review';

/** Coverage factor of the disagreement marks: the same k = 2 as the station series' merge (series.service.ts). */
export const DISAGREEMENT_COVERAGE_FACTOR = 2;
/** Stands in for a missing uncertainty, hPa, as the merge does. */
const DEFAULT_UNCERTAINTY_HPA = 0.5;

/** The difference of two lines at one common time: b − a in hPa, and whether it is beyond k·√(u_a² + u_b²). */
export interface LineDifferencePoint {
  timeMs: number;
  differenceHpa: number;
  isBeyondUncertainty: boolean;
}

/** b − a at every time both lines have, in time order. */
export function lineDifferences(a: readonly StoredPointView[], b: readonly StoredPointView[]): LineDifferencePoint[] {
  const byTime = new Map(b.map((point) => [point.time, point]));
  return a.flatMap((point) => {
    const other = byTime.get(point.time);
    if (!other) return [];
    const differenceHpa = other.pressureHpa - point.pressureHpa;
    const combined = Math.hypot(point.uncertaintyHpa ?? DEFAULT_UNCERTAINTY_HPA, other.uncertaintyHpa ?? DEFAULT_UNCERTAINTY_HPA);
    return [{ timeMs: Date.parse(point.time), differenceHpa, isBeyondUncertainty: Math.abs(differenceHpa) > DISAGREEMENT_COVERAGE_FACTOR * combined }];
  });
}
