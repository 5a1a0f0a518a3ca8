/**
 * Contrast adapted along the line: faded ink scores well below full ink, and the path search pays for weak runs
 * and for sudden changes of strength. Each column's runs are divided by the ink's local strength — the strongest
 * run peak within a few millimetres of time either side — so a faded stretch scores like full ink. Where no ink is
 * near (a pen skip) the local strength is only noise, and nothing is raised.
 */
import type { ColumnRuns } from './column-runs';

/** Local strength below this share of full ink is taken as no ink: runs there are left as they are. */
const MIN_STRENGTH = 0.2;

export function adaptRunsToLocalStrength(runs: ColumnRuns, reachColumns: number, threshold: number): void {
  const { columns, slots } = runs;
  const strongest = new Float32Array(columns);
  for (let i = 0; i < columns; i++) {
    let best = 0;
    for (let k = 0; k < runs.count[i]; k++) best = Math.max(best, runs.peak[i * slots + k]);
    strongest[i] = best;
  }
  const local = slidingMax(strongest, Math.max(1, Math.round(reachColumns)));
  const floor = Math.max(MIN_STRENGTH, 2 * threshold);
  for (let i = 0; i < columns; i++) {
    const strength = local[i];
    if (strength >= 1 || strength < floor) continue;
    const factor = 1 / strength;
    for (let k = 0; k < runs.count[i]; k++) {
      const j = i * slots + k;
      runs.mass[j] *= factor;
      runs.peak[j] *= factor;
    }
  }
}

/** Maximum over [i − reach, i + reach] for every i (monotone deque, linear time). */
export function slidingMax(values: Float32Array, reach: number): Float32Array {
  const n = values.length;
  const out = new Float32Array(n);
  const deque = new Int32Array(n);
  let head = 0;
  let tail = 0;
  let next = 0;
  for (let i = 0; i < n; i++) {
    const end = Math.min(n - 1, i + reach);
    while (next <= end) {
      while (tail > head && values[deque[tail - 1]] <= values[next]) tail--;
      deque[tail++] = next++;
    }
    while (deque[head] < i - reach) head++;
    out[i] = values[deque[head]];
  }
  return out;
}
