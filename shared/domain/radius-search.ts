/**
 * Finds the curvature κ = 1/R (mm⁻¹, in [0, maxCurvature]) that minimises a pin-fit error.
 * A coarse scan guards against a local minimum; golden-section search then refines the best bracket.
 * Working in curvature keeps straight lines (κ = 0) inside the search range.
 */
export function findRadiusCurvature(error: (curvature: number) => number, maxCurvature: number, steps = 40): number {
  let bestIndex = 0;
  let bestError = Number.POSITIVE_INFINITY;
  for (let i = 0; i <= steps; i++) {
    const e = error((maxCurvature * i) / steps);
    if (e < bestError) {
      bestError = e;
      bestIndex = i;
    }
  }
  let low = (maxCurvature * Math.max(0, bestIndex - 1)) / steps;
  let high = (maxCurvature * Math.min(steps, bestIndex + 1)) / steps;
  // The bounds themselves stay candidates, so that straight lines (0) and R = H/2 are found exactly.
  const bounds = [low, high];
  const ratio = (Math.sqrt(5) - 1) / 2;
  let a = high - ratio * (high - low);
  let b = low + ratio * (high - low);
  let ea = error(a);
  let eb = error(b);
  for (let iteration = 0; iteration < 80 && high - low > maxCurvature * 1e-12; iteration++) {
    if (ea < eb) {
      high = b;
      b = a;
      eb = ea;
      a = high - ratio * (high - low);
      ea = error(a);
    } else {
      low = a;
      a = b;
      ea = eb;
      b = low + ratio * (high - low);
      eb = error(b);
    }
  }
  const candidates = [...bounds, low, (low + high) / 2, high];
  return candidates.reduce((best, c) => (error(c) < error(best) ? c : best));
}
