/**
 * Flags values far beyond the others by the modified z-score (Iglewicz & Hoaglin 1993, threshold 3.5):
 * z = 0.6745·(x − median)/MAD. A floor on the MAD (floorMad, same unit as values) keeps near-exact fits from
 * flagging noise, and values below minValue are never flagged. Values are non-negative distances here.
 */
export function flagOutliers(values: number[], options: { threshold?: number; floorMad?: number; minValue?: number } = {}): boolean[] {
  const threshold = options.threshold ?? 3.5;
  const floorMad = options.floorMad ?? 0.02;
  const minValue = options.minValue ?? 0.25;
  if (values.length < 3) return values.map(() => false);
  const center = median(values);
  const mad = Math.max(median(values.map((v) => Math.abs(v - center))), floorMad);
  return values.map((v) => v >= minValue && (0.6745 * (v - center)) / mad > threshold);
}

/** Median of a non-empty list. */
export function median(values: number[]): number {
  const sorted = values.slice().sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}
