/**
 * The pen's way through a steep stroke (a pressure jump drawn nearly along the time arc). Down a time column such a
 * stroke is a long run whose centre says little; across the stroke — along an image row, in time columns — it is
 * about a pen wide, so its centre there is where the pen passed. The stroke is followed row by row from the level
 * it leaves the line to the level it rejoins it, and its time is kept monotone (the drum only turns forward).
 */
import { type ChartWindow } from './chart-window';
import type { PixelScore } from './pixel-score';

export interface SteepStrokeRequest {
  /** Time columns of the ordinary points before and after the stroke (the pen's time lies between them). */
  fromColumn: number;
  toColumn: number;
  /** Levels (rows, continuous) where the stroke leaves and rejoins the line. */
  fromY: number;
  toY: number;
  /** Columns searched along each row. */
  searchFirst: number;
  searchLast: number;
}

/** Points of the stroke's centre line, in the order the pen drew them: sub-column time column and row. */
export interface SteepStrokePath {
  column: number[];
  y: number[];
}

/** Row by row centre of a steep stroke; rows where no ink crosses are left out. */
export function centreSteepStroke(score: PixelScore, window: ChartWindow, threshold: number, request: SteepStrokeRequest): SteepStrokePath {
  const { fromColumn, toColumn, fromY, toY } = request;
  const direction = toY >= fromY ? 1 : -1;
  const first = Math.max(0, request.searchFirst);
  const last = Math.min(window.rowTop.length - 1, request.searchLast);
  const rawColumns: number[] = [];
  const rows: number[] = [];
  const profile = new Float32Array(Math.max(0, last - first + 1));
  let previous = fromColumn;
  // Row centres strictly between the two levels.
  const startRow = direction > 0 ? Math.ceil(fromY - 0.5) : Math.floor(fromY - 0.5);
  for (let row = startRow; direction * (row + 0.5 - toY) < 0; row += direction) {
    if (direction * (row + 0.5 - fromY) <= 0) continue;
    if (row < 1 || row >= window.rowShift.length - 1) continue;
    // Score along the row in time columns, smoothed [1 2 1]/4 down the column (each row on its own arc).
    for (let c = first; c <= last; c++) {
      let s = 0;
      for (let d = -1; d <= 1; d++) {
        const y = row + d;
        s += (d === 0 ? 0.5 : 0.25) * score(window.x0 + c + Math.round(window.rowShift[y]), y);
      }
      profile[c - first] = s;
    }
    const centre = nearestRunCentre(profile, first, threshold, previous);
    if (centre === null) continue;
    rawColumns.push(centre);
    rows.push(row + 0.5);
    previous = centre;
  }
  return { column: monotoneBetween(rawColumns, fromColumn, toColumn), y: rows };
}

/** Score-weighted centre (in column index units) of the above-threshold run nearest `near`; null when none. */
function nearestRunCentre(profile: Float32Array, first: number, threshold: number, near: number): number | null {
  let best: number | null = null;
  let bestDistance = Infinity;
  let mass = 0;
  let moment = 0;
  let start = -1;
  for (let k = 0; k <= profile.length; k++) {
    const s = k < profile.length ? profile[k] : -Infinity;
    if (s >= threshold) {
      if (start < 0) {
        start = k;
        mass = 0;
        moment = 0;
      }
      mass += s;
      moment += s * (first + k);
      continue;
    }
    if (start < 0) continue;
    const centre = moment / mass;
    const distance = Math.max(0, first + start - near, near - (first + k - 1));
    if (distance < bestDistance) {
      bestDistance = distance;
      best = centre;
    }
    start = -1;
  }
  return best;
}

/**
 * The closest non-decreasing sequence (least squares: pool adjacent violators), then held within [low, high]:
 * the pen's time along the stroke never runs backwards, and stays between the ordinary points around it.
 */
export function monotoneBetween(values: number[], low: number, high: number): number[] {
  const means: number[] = [];
  const counts: number[] = [];
  for (const v of values) {
    means.push(v);
    counts.push(1);
    while (means.length > 1 && means[means.length - 2] > means[means.length - 1]) {
      const m = means.pop() as number;
      const n = counts.pop() as number;
      const k = means.length - 1;
      means[k] = (means[k] * counts[k] + m * n) / (counts[k] + n);
      counts[k] += n;
    }
  }
  const out: number[] = [];
  means.forEach((m, k) => {
    for (let n = 0; n < counts[k]; n++) out.push(Math.min(high, Math.max(low, m)));
  });
  return out;
}
