/**
 * Turning the chosen runs of the path search into the points of the ink line: centres, steep strokes,
 * time marks.
 */
import { type ChartWindow, columnX } from './chart-window';
import type { ColumnRuns, LineWidth } from './column-runs';
import { runReward } from './path-search';

/** Points of the followed line under construction, in time-column order. */
export interface PointList {
  x: number[];
  y: number[];
  confidence: number[];
  /** Time column of each point. */
  column: number[];
}

/**
 * Turns the chosen runs into points. A run gives its centre, unless it is much longer than the line's slope
 * explains (a time mark standing on the line, or the pen moving almost vertically): then it gives the pen's way
 * through the column, in at the end nearer the previous point and out at the end nearer the next ordinary run,
 * so a jump keeps its height and a time mark is stepped over.
 */
export function collectPoints(
  runs: ColumnRuns,
  window: ChartWindow,
  chosen: Int16Array,
  line: LineWidth,
  points: PointList,
  gapColumns: { first: number; last: number }[],
  ticks: { x: number; y: number }[],
): void {
  const { slots } = runs;
  const widthPx = line.runLengthPx;
  // A run's end is where the score crosses the threshold: the line's centre is half a run length inside it.
  const half = line.runLengthPx / 2;
  const long = markLongRuns(runs, chosen, widthPx);
  let gapStart = -1;
  let lastY = NaN;
  for (let i = 0; i < runs.columns; i++) {
    const k = chosen[i];
    if (k < 0) {
      if (gapStart < 0) gapStart = i;
      continue;
    }
    if (gapStart >= 0) {
      gapColumns.push({ first: gapStart, last: i - 1 });
      gapStart = -1;
    }
    const j = i * slots + k;
    if (long[i] === 0) {
      points.x.push(columnX(window, i, runs.centre[j]));
      points.y.push(runs.centre[j]);
      points.confidence.push(confidenceOf(runs, i, k, widthPx));
      points.column.push(i);
      lastY = runs.centre[j];
      continue;
    }
    // A stretch of long runs: a stroke as wide as the pen, standing across several columns. Its middle column
    // says where it is; the ordinary runs before and after it say whether the pen went through it or only up and back.
    let last = i;
    while (last + 1 < runs.columns && chosen[last + 1] >= 0 && long[last + 1] === 1) last++;
    const first = i;
    const middle = (i + last) >> 1;
    // Judge the stretch by its whole extent: on a blurred or noisy scan one column may hold only part of the stroke.
    let sectionTop = Infinity;
    let sectionBottom = -Infinity;
    for (let c = i; c <= last; c++) {
      const q = c * slots + chosen[c];
      sectionTop = Math.min(sectionTop, runs.top[q]);
      sectionBottom = Math.max(sectionBottom, runs.bottom[q]);
    }
    const upper = sectionTop + half;
    const lower = sectionBottom - half;
    const next = last + 1 < runs.columns && chosen[last + 1] >= 0 ? runs.centre[(last + 1) * slots + chosen[last + 1]] : NaN;
    const previousY = Number.isNaN(lastY) ? (Number.isNaN(next) ? (upper + lower) / 2 : next) : lastY;
    const nextY = Number.isNaN(next) ? previousY : next;
    const entryY = Math.abs(previousY - upper) < Math.abs(previousY - lower) ? upper : lower;
    const exitY = Math.abs(nextY - upper) < Math.abs(nextY - lower) ? upper : lower;
    i = last;
    if (exitY === entryY) {
      // In and out at the same end: the line runs along that end of a stroke standing on it — a time mark when
      // the stroke is about a pen wide, otherwise another line touching this one.
      const isUpper = entryY === upper;
      for (let c = first; c <= last; c++) {
        const q = c * slots + chosen[c];
        const y = isUpper ? runs.top[q] + half : runs.bottom[q] - half;
        points.x.push(columnX(window, c, y));
        points.y.push(y);
        points.confidence.push(0.5 * confidenceOf(runs, c, chosen[c], widthPx));
        points.column.push(c);
      }
      if (last - first + 1 <= 2 * line.widthPx + 3) ticks.push({ x: columnX(window, middle, entryY), y: entryY });
      lastY = entryY;
      continue;
    }
    // The stroke's centre across its width: the mass-weighted mean column of the stretch (sub-column).
    let massSum = 0;
    let moment = 0;
    for (let c = first; c <= last; c++) {
      const mass = runs.mass[c * slots + chosen[c]];
      massSum += mass;
      moment += mass * c;
    }
    const centreColumn = massSum > 0 ? moment / massSum : middle;
    const confidence = confidenceOf(runs, middle, chosen[middle], widthPx);
    points.x.push(columnX(window, centreColumn, entryY), columnX(window, centreColumn, exitY));
    points.y.push(entryY, exitY);
    points.confidence.push(confidence, confidence);
    points.column.push(middle, middle);
    lastY = exitY;
  }
  if (gapStart >= 0) gapColumns.push({ first: gapStart, last: runs.columns - 1 });
  dropPointsBesideTicks(points, ticks, line.widthPx);
}

/** The columns just beside a time mark still hold some of its stroke, which pulls their centres off the line. */
function dropPointsBesideTicks(points: PointList, ticks: { x: number; y: number }[], widthPx: number): void {
  if (ticks.length === 0) return;
  const reach = widthPx / 2 + 1;
  let t = 0;
  let kept = 0;
  for (let i = 0; i < points.x.length; i++) {
    const x = points.x[i];
    while (t < ticks.length - 1 && ticks[t + 1].x < x) t++;
    const near = Math.abs(ticks[t].x - x) <= reach || (t + 1 < ticks.length && Math.abs(ticks[t + 1].x - x) <= reach);
    if (near) continue;
    points.x[kept] = x;
    points.y[kept] = points.y[i];
    points.confidence[kept] = points.confidence[i];
    points.column[kept] = points.column[i];
    kept++;
  }
  points.column.length = kept;
  points.x.length = kept;
  points.y.length = kept;
  points.confidence.length = kept;
}

/**
 * 1 for a chosen run longer than the line's local slope explains by more than 1.5 widths. The slope comes
 * from the runs about one line width to either side, outside any time mark on this column.
 */
function markLongRuns(runs: ColumnRuns, chosen: Int16Array, widthPx: number): Uint8Array {
  const long = new Uint8Array(runs.columns);
  const reach = Math.max(2, Math.ceil(widthPx));
  const centreAt = (i: number): number => (i >= 0 && i < runs.columns && chosen[i] >= 0 ? runs.centre[i * runs.slots + chosen[i]] : NaN);
  for (let i = 0; i < runs.columns; i++) {
    if (chosen[i] < 0) continue;
    const j = i * runs.slots + chosen[i];
    const length = runs.bottom[j] - runs.top[j];
    if (length <= 2.2 * widthPx) continue;
    const before = centreAt(i - reach);
    const after = centreAt(i + reach);
    let slope = 0;
    if (!Number.isNaN(before) && !Number.isNaN(after)) slope = Math.abs(after - before) / (2 * reach);
    else if (!Number.isNaN(before)) slope = Math.abs(runs.centre[j] - before) / reach;
    else if (!Number.isNaN(after)) slope = Math.abs(after - runs.centre[j]) / reach;
    const expected = widthPx * Math.sqrt(1 + slope * slope);
    if (length > expected + 1.5 * widthPx) long[i] = 1;
  }
  return long;
}

/** Neighbouring tick columns belong to one stroke; its foot is their mean position. */
export function groupTicks(ticks: { x: number; y: number }[], widthPx: number): { xPx: number; yPx: number }[] {
  const marks: { xPx: number; yPx: number }[] = [];
  let group: { x: number; y: number }[] = [];
  const flush = () => {
    if (group.length === 0) return;
    marks.push({ xPx: group.reduce((s, t) => s + t.x, 0) / group.length, yPx: group.reduce((s, t) => s + t.y, 0) / group.length });
    group = [];
  };
  for (const tick of ticks) {
    if (group.length > 0 && tick.x - group[group.length - 1].x > Math.max(1.5, widthPx / 2)) flush();
    group.push(tick);
  }
  flush();
  return marks;
}


/** Reward of the chosen run (≈ 1 on full ink), lowered when another run in the column is nearly as strong. */
function confidenceOf(runs: ColumnRuns, i: number, k: number, widthPx: number): number {
  const j = i * runs.slots + k;
  const reward = runReward(runs, j, widthPx);
  let rival = 0;
  for (let other = 0; other < runs.count[i]; other++) {
    if (other === k) continue;
    const q = i * runs.slots + other;
    if (Math.abs(runs.centre[q] - runs.centre[j]) > 2 * widthPx) rival = Math.max(rival, runReward(runs, q, widthPx));
  }
  const clear = rival > 0.8 * reward ? 0.6 : 1;
  return Math.max(0, Math.min(1, reward)) * clear;
}

