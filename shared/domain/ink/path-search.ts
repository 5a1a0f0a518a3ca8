import type { ColumnRuns } from './column-runs';

/**
 * Costs of the path search, in units of "one column of full ink". The path earns (reward − inkFloor) per
 * column on a run, nothing in a gap, and pays for breaking contact between neighbouring columns.
 */
export interface PathCosts {
  /** Reward a run must beat to be worth standing on. */
  inkFloor: number;
  /** Flat cost of a break in contact between runs of neighbouring columns, plus a quadratic part per line width. */
  breakCost: number;
  breakCostPerWidth2: number;
  /** Cost of leaving the ink for a gap, and of coming back. */
  gapExitCost: number;
  gapEntryCost: number;
  /** Cost per line width between where the gap left and where the line comes back. */
  gapReturnCostPerWidth: number;
  /** Cost per bin the remembered position drifts per column during a gap. */
  gapDriftCost: number;
  /** Small cost on centre changes between short runs, to stop zigzags between touching lines. */
  centreCostPerWidth2: number;
}

export const DEFAULT_PATH_COSTS: PathCosts = {
  inkFloor: 0.15,
  breakCost: 1.5,
  breakCostPerWidth2: 0.5,
  gapExitCost: 1.5,
  gapEntryCost: 1.5,
  gapReturnCostPerWidth: 1,
  gapDriftCost: 0.3,
  centreCostPerWidth2: 0.1,
};

/** A pixel the path must pass within `radiusPx` of (a click on the pen line). */
export interface PathSeed {
  column: number;
  yPx: number;
  radiusPx: number;
}

const START = -2147483648;
const FORBIDDEN = 1e12;

/** Reward of run j: half its mean score over at least one line width, half its peak (both about 1 on full ink). */
export function runReward(runs: ColumnRuns, j: number, widthPx: number): number {
  const length = runs.bottom[j] - runs.top[j];
  return 0.5 * (runs.mass[j] / Math.max(length, widthPx)) + 0.5 * Math.min(1.5, runs.peak[j]);
}

/**
 * Finds the globally cheapest path through the columns (Viterbi over runs plus a gap state that remembers
 * the row band where the ink was left). Returns, per column, the chosen run's slot, or −1 in a gap.
 * Memory: two back-pointer arrays (columns × slots, columns × bins) of Int32.
 */
export function searchInkPath(
  runs: ColumnRuns,
  rowMin: number,
  rowMax: number,
  widthPx: number,
  costs: PathCosts = DEFAULT_PATH_COSTS,
  seed?: PathSeed,
): Int16Array {
  const { columns, slots } = runs;
  const chosen = new Int16Array(columns).fill(-1);
  if (columns === 0) return chosen;
  const binPx = Math.max(2, 2 * widthPx);
  const bins = Math.max(1, Math.ceil((rowMax - rowMin) / binPx) + 1);
  const binOf = (y: number): number => Math.min(bins - 1, Math.max(0, Math.floor((y - rowMin) / binPx)));
  const returnPerBin = (costs.gapReturnCostPerWidth * binPx) / widthPx;

  const backRun = new Int32Array(columns * slots);
  const backGap = new Int32Array(columns * bins);
  let previousRun = new Float64Array(slots);
  let currentRun = new Float64Array(slots);
  let previousGap = new Float64Array(bins);
  let currentGap = new Float64Array(bins);
  const entry = new Float64Array(bins);
  const entryFrom = new Int32Array(bins);
  const unary = new Float64Array(slots);

  const fillUnary = (i: number): void => {
    for (let k = 0; k < runs.count[i]; k++) {
      const j = i * slots + k;
      let cost = costs.inkFloor - runReward(runs, j, widthPx);
      if (seed && seed.column === i && Math.abs(runs.centre[j] - seed.yPx) > seed.radiusPx && !(runs.top[j] <= seed.yPx && runs.bottom[j] >= seed.yPx)) {
        cost += FORBIDDEN;
      }
      unary[k] = cost;
    }
  };

  fillUnary(0);
  for (let k = 0; k < runs.count[0]; k++) {
    previousRun[k] = unary[k];
    backRun[k] = START;
  }
  for (let b = 0; b < bins; b++) {
    previousGap[b] = seed && seed.column === 0 ? FORBIDDEN : 0;
    backGap[b] = START;
  }

  for (let i = 1; i < columns; i++) {
    const prevBase = (i - 1) * slots;
    const base = i * slots;
    const prevCount = runs.count[i - 1];
    const count = runs.count[i];
    fillUnary(i);

    // Entry from the gap state: an L1 distance transform over bins gives every bin its cheapest return.
    for (let b = 0; b < bins; b++) {
      entry[b] = previousGap[b];
      entryFrom[b] = b;
    }
    for (let b = 1; b < bins; b++) {
      if (entry[b - 1] + returnPerBin < entry[b]) {
        entry[b] = entry[b - 1] + returnPerBin;
        entryFrom[b] = entryFrom[b - 1];
      }
    }
    for (let b = bins - 2; b >= 0; b--) {
      if (entry[b + 1] + returnPerBin < entry[b]) {
        entry[b] = entry[b + 1] + returnPerBin;
        entryFrom[b] = entryFrom[b + 1];
      }
    }

    for (let k = 0; k < count; k++) {
      const j = base + k;
      const top = runs.top[j];
      const bottom = runs.bottom[j];
      const isShort = bottom - top <= 2 * widthPx;
      const entryBin = binOf(runs.centre[j]);
      let best = entry[entryBin] + costs.gapEntryCost;
      let from = -1 - entryFrom[entryBin];
      for (let p = 0; p < prevCount; p++) {
        const q = prevBase + p;
        const separation = Math.max(0, top - runs.bottom[q], runs.top[q] - bottom) - 1;
        let cost = previousRun[p];
        if (separation > 0) cost += costs.breakCost + costs.breakCostPerWidth2 * (separation / widthPx) ** 2;
        if (isShort && runs.bottom[q] - runs.top[q] <= 2 * widthPx) {
          cost += costs.centreCostPerWidth2 * ((runs.centre[j] - runs.centre[q]) / widthPx) ** 2;
        }
        if (cost < best) {
          best = cost;
          from = p;
        }
      }
      currentRun[k] = best + unary[k];
      backRun[j] = from;
    }

    // The gap state: stay in the same band, drift one band, or leave the ink from a run of the last column.
    const gapBase = i * bins;
    const seedPenalty = seed && seed.column === i ? FORBIDDEN : 0;
    for (let b = 0; b < bins; b++) {
      let best = previousGap[b];
      let from = -1 - b;
      if (b > 0 && previousGap[b - 1] + costs.gapDriftCost < best) {
        best = previousGap[b - 1] + costs.gapDriftCost;
        from = -1 - (b - 1);
      }
      if (b + 1 < bins && previousGap[b + 1] + costs.gapDriftCost < best) {
        best = previousGap[b + 1] + costs.gapDriftCost;
        from = -1 - (b + 1);
      }
      currentGap[b] = best + seedPenalty;
      backGap[gapBase + b] = from;
    }
    for (let p = 0; p < prevCount; p++) {
      const b = binOf(runs.centre[prevBase + p]);
      const cost = previousRun[p] + costs.gapExitCost + seedPenalty;
      if (cost < currentGap[b]) {
        currentGap[b] = cost;
        backGap[gapBase + b] = p;
      }
    }

    let swap = previousRun;
    previousRun = currentRun;
    currentRun = swap;
    swap = previousGap;
    previousGap = currentGap;
    currentGap = swap;
  }

  // Best end state, then walk the back pointers.
  let state = 0;
  let isGap = true;
  let best = Infinity;
  for (let b = 0; b < bins; b++) if (previousGap[b] < best) [best, state, isGap] = [previousGap[b], b, true];
  for (let k = 0; k < runs.count[columns - 1]; k++) if (previousRun[k] < best) [best, state, isGap] = [previousRun[k], k, false];
  for (let i = columns - 1; i >= 0; i--) {
    const pointer = isGap ? backGap[i * bins + state] : backRun[i * slots + state];
    if (!isGap) chosen[i] = state;
    if (pointer === START) break;
    if (pointer >= 0) {
      state = pointer;
      isGap = false;
    } else {
      state = -1 - pointer;
      isGap = true;
    }
  }
  return chosen;
}
