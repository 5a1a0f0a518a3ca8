/**
 * Turning the chosen runs of the path search into the points of the ink line: centres, steep strokes,
 * time marks.
 */
import { type ChartWindow, columnX } from './chart-window';
import type { ColumnRuns, LineWidth } from './column-runs';
import { runReward } from './path-search';
import type { PixelScore } from './pixel-score';
import { centreSteepStroke } from './steep-stroke';

/** Points of the followed line under construction, in time-column order. */
export interface PointList {
  x: number[];
  y: number[];
  confidence: number[];
  /** Time column of each point. */
  column: number[];
  /** 0 for an ordinary point; k > 0 for the points of the k-th steep stroke (a jump) followed across its width. */
  stroke: number[];
}

/** A foot of a time mark found while stepping over it, with its time column. */
export interface TickFoot {
  x: number;
  y: number;
  column: number;
}

/** What the steep-stroke rule needs beyond the runs: the pixels' scores and the run threshold. */
export interface StrokeScoring {
  score: PixelScore;
  threshold: number;
}

// A run this much longer than the flat line's runs stands steeper than 45° (length ≈ width · √(1 + slope²)).
const STEEP_RUN_FACTOR = Math.SQRT2;

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
  ticks: TickFoot[],
  scoring: StrokeScoring,
): void {
  const { slots } = runs;
  const widthPx = line.runLengthPx;
  // A run's end is where the score crosses the threshold: the line's centre is half a run length inside it.
  const half = line.runLengthPx / 2;
  const long = markLongRuns(runs, chosen, widthPx);
  let gapStart = -1;
  let lastY = NaN;
  let strokeCount = 0;
  // Columns up to here belong to an earlier stretch and may not be taken back by a steep stroke.
  let settled = -1;
  const isSteep = (c: number): boolean => {
    if (c < 0 || c >= runs.columns || chosen[c] < 0) return false;
    const q = c * slots + chosen[c];
    return runs.bottom[q] - runs.top[q] > STEEP_RUN_FACTOR * widthPx;
  };
  const push = (x: number, y: number, confidence: number, column: number, stroke = 0): void => {
    points.x.push(x);
    points.y.push(y);
    points.confidence.push(confidence);
    points.column.push(column);
    points.stroke.push(stroke);
  };
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
      push(columnX(window, i, runs.centre[j]), runs.centre[j], confidenceOf(runs, i, k, widthPx), i);
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
        push(columnX(window, c, y), y, 0.5 * confidenceOf(runs, c, chosen[c], widthPx), c);
      }
      if (last - first + 1 <= 2 * line.widthPx + 3) ticks.push({ x: columnX(window, middle, entryY), y: entryY, column: middle });
      lastY = entryY;
      settled = last;
      continue;
    }
    // In at one end, out at the other: the pen went through — a jump. Take in the steep columns on either side (the
    // stroke's flanks), then follow it across its width from the level it left the line to the level it rejoins it.
    let strokeFirst = first;
    while (strokeFirst - 1 > settled && isSteep(strokeFirst - 1)) strokeFirst--;
    let strokeLast = last;
    while (strokeLast + 1 < runs.columns && isSteep(strokeLast + 1)) strokeLast++;
    while (points.column.length > 0 && points.column[points.column.length - 1] >= strokeFirst) {
      points.x.pop();
      points.y.pop();
      points.confidence.pop();
      points.column.pop();
      points.stroke.pop();
    }
    const hasBefore = points.column.length > 0 && points.column[points.column.length - 1] >= strokeFirst - 2 * widthPx - 2;
    const before = hasBefore ? points.y[points.y.length - 1] : NaN;
    const fromColumn = hasBefore ? points.column[points.column.length - 1] : strokeFirst - 1;
    const afterColumn = strokeLast + 1;
    const after = afterColumn < runs.columns && chosen[afterColumn] >= 0 && long[afterColumn] === 0 ? runs.centre[afterColumn * slots + chosen[afterColumn]] : NaN;
    const fromY = Number.isNaN(before) ? entryY : before;
    const toY = Number.isNaN(after) ? exitY : after;
    const reach = Math.ceil(widthPx);
    const path = centreSteepStroke(scoring.score, window, scoring.threshold, {
      fromColumn,
      toColumn: strokeLast + 1,
      fromY,
      toY,
      searchFirst: strokeFirst - reach,
      searchLast: strokeLast + reach,
    });
    let confidence = 0;
    for (let c = strokeFirst; c <= strokeLast; c++) confidence += confidenceOf(runs, c, chosen[c], widthPx);
    confidence /= strokeLast - strokeFirst + 1;
    strokeCount++;
    if (path.y.length === 0) {
      // No row crossed by ink (a pen skip in the stroke): keep its two ends at its middle column.
      push(columnX(window, middle, entryY), entryY, confidence, middle, strokeCount);
      push(columnX(window, middle, exitY), exitY, confidence, middle, strokeCount);
    }
    for (let n = 0; n < path.y.length; n++) {
      const column = Math.min(strokeLast, Math.max(strokeFirst, Math.round(path.column[n])));
      push(columnX(window, path.column[n], path.y[n]), path.y[n], confidence, column, strokeCount);
    }
    i = strokeLast;
    settled = strokeLast;
    lastY = path.y.length > 0 ? path.y[path.y.length - 1] : exitY;
  }
  if (gapStart >= 0) gapColumns.push({ first: gapStart, last: runs.columns - 1 });
  dropPointsBesideTicks(points, ticks, line.widthPx);
}

/** The columns just beside a time mark still hold some of its stroke, which pulls their centres off the line. */
function dropPointsBesideTicks(points: PointList, ticks: TickFoot[], widthPx: number): void {
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
    points.stroke[kept] = points.stroke[i];
    kept++;
  }
  points.column.length = kept;
  points.stroke.length = kept;
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
export function groupTicks(ticks: TickFoot[], widthPx: number): { xPx: number; yPx: number; column: number }[] {
  const marks: { xPx: number; yPx: number; column: number }[] = [];
  let group: TickFoot[] = [];
  const flush = () => {
    if (group.length === 0) return;
    const mean = (f: (t: TickFoot) => number) => group.reduce((s, t) => s + f(t), 0) / group.length;
    marks.push({ xPx: mean((t) => t.x), yPx: mean((t) => t.y), column: mean((t) => t.column) });
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

