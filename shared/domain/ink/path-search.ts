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
  /** Cost per line width between where the gap left and where the line comes back, beyond the allowance. */
  gapReturnCostPerWidth: number;
  /** How far (line widths, plus this share of a width per column of gap) the line may move during a gap for free. */
  gapAllowanceWidths: number;
  gapAllowancePerColumn: number;
  /** Small cost on centre changes between short runs, to stop zigzags between touching lines. */
  centreCostPerWidth2: number;
  /**
   * Cost per unit change of reward between consecutive runs beyond a dead zone: a pen line fades slowly, so a
   * sudden drop from full ink to a faint line is a hop onto another trace (also checked across a gap).
   */
  strengthChangeCost: number;
  strengthDeadZone: number;
}

export const DEFAULT_PATH_COSTS: PathCosts = {
  inkFloor: 0.15,
  breakCost: 1.5,
  breakCostPerWidth2: 0.5,
  gapExitCost: 1.5,
  gapEntryCost: 1.5,
  gapReturnCostPerWidth: 1,
  gapAllowanceWidths: 2,
  gapAllowancePerColumn: 0.1,
  centreCostPerWidth2: 0.1,
  strengthChangeCost: 8,
  strengthDeadZone: 0.15,
};

/** A pixel the path must pass within `radiusPx` of (a click on the pen line). */
export interface PathSeed {
  column: number;
  yPx: number;
  radiusPx: number;
}

const START = -2147483648;
const FROM_GAP = -1;
const FORBIDDEN = 1e12;

/** Reward of run j: half its mean score over at least one line width, half its peak (both about 1 on full ink). */
export function runReward(runs: ColumnRuns, j: number, widthPx: number): number {
  const length = runs.bottom[j] - runs.top[j];
  return 0.5 * (runs.mass[j] / Math.max(length, widthPx)) + 0.5 * Math.min(1.5, runs.peak[j]);
}

/**
 * Finds the globally cheapest path through the columns: Viterbi over each column's runs, plus one gap state
 * that remembers where (row, column) the best path left the ink, so that the line coming back far from there
 * pays for it. Returns, per column, the chosen run's slot, or −1 in a gap. Memory: columns × (slots + 1) Int32.
 */
export function searchInkPath(
  runs: ColumnRuns,
  widthPx: number,
  costs: PathCosts = DEFAULT_PATH_COSTS,
  seed?: PathSeed,
  contactSlackPx = 1,
): Int16Array {
  const { columns, slots } = runs;
  const chosen = new Int16Array(columns).fill(-1);
  if (columns === 0) return chosen;
  const backRun = new Int32Array(columns * slots);
  const backGap = new Int32Array(columns);
  let previousRun = new Float64Array(slots);
  let currentRun = new Float64Array(slots);
  const unary = new Float64Array(slots);
  let previousReward = new Float64Array(slots);
  let currentReward = new Float64Array(slots);
  let gapCost = seed && seed.column === 0 ? FORBIDDEN : 0;
  let gapY = NaN;
  let gapReward = NaN;
  const strengthCost = (a: number, b: number): number => costs.strengthChangeCost * Math.max(0, Math.abs(a - b) - costs.strengthDeadZone);
  let gapStart = 0;

  const fillUnary = (i: number): void => {
    for (let k = 0; k < runs.count[i]; k++) {
      const j = i * slots + k;
      const reward = runReward(runs, j, widthPx);
      currentReward[k] = reward;
      let cost = costs.inkFloor - reward;
      if (seed && seed.column === i && Math.abs(runs.centre[j] - seed.yPx) > seed.radiusPx && !(runs.top[j] <= seed.yPx && runs.bottom[j] >= seed.yPx)) {
        cost += FORBIDDEN;
      }
      unary[k] = cost;
    }
  };

  fillUnary(0);
  for (let k = 0; k < runs.count[0]; k++) {
    previousRun[k] = unary[k];
    previousReward[k] = currentReward[k];
    backRun[k] = START;
  }
  backGap[0] = START;

  for (let i = 1; i < columns; i++) {
    const prevBase = (i - 1) * slots;
    const base = i * slots;
    const prevCount = runs.count[i - 1];
    const count = runs.count[i];
    fillUnary(i);
    const allowancePx = widthPx * (costs.gapAllowanceWidths + costs.gapAllowancePerColumn * (i - gapStart));

    for (let k = 0; k < count; k++) {
      const j = base + k;
      const top = runs.top[j];
      const bottom = runs.bottom[j];
      const isShort = bottom - top <= 2 * widthPx;
      const away = Number.isNaN(gapY) ? 0 : Math.max(0, Math.abs(runs.centre[j] - gapY) - allowancePx);
      const reward = currentReward[k];
      let best = gapCost + costs.gapEntryCost + (costs.gapReturnCostPerWidth * away) / widthPx + (Number.isNaN(gapReward) ? 0 : strengthCost(reward, gapReward));
      let from = FROM_GAP;
      for (let p = 0; p < prevCount; p++) {
        const q = prevBase + p;
        const separation = Math.max(0, top - runs.bottom[q], runs.top[q] - bottom) - contactSlackPx;
        let cost = previousRun[p] + strengthCost(reward, previousReward[p]);
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

    // The gap state: stay in it, or leave the ink from a run of the last column (remembering where).
    let nextGap = gapCost;
    let from = FROM_GAP;
    for (let p = 0; p < prevCount; p++) {
      const cost = previousRun[p] + costs.gapExitCost;
      if (cost < nextGap) {
        nextGap = cost;
        from = p;
      }
    }
    if (from !== FROM_GAP) {
      gapY = runs.centre[prevBase + from];
      gapReward = previousReward[from];
      gapStart = i;
    }
    gapCost = nextGap + (seed && seed.column === i ? FORBIDDEN : 0);
    backGap[i] = from;

    const swap = previousRun;
    previousRun = currentRun;
    currentRun = swap;
    const swapReward = previousReward;
    previousReward = currentReward;
    currentReward = swapReward;
  }

  // Best end state, then walk the back pointers.
  let state = -1;
  let best = gapCost;
  for (let k = 0; k < runs.count[columns - 1]; k++) {
    if (previousRun[k] < best) {
      best = previousRun[k];
      state = k;
    }
  }
  for (let i = columns - 1; i >= 0; i--) {
    const pointer = state < 0 ? backGap[i] : backRun[i * slots + state];
    if (state >= 0) chosen[i] = state;
    if (pointer === START) break;
    state = pointer;
  }
  return chosen;
}
