import type { ChartForm } from '../chart-form';
import { pixelToReading, type RegistrationFit } from '../registration';
import { chartWindow, type ChartWindow, columnX } from './chart-window';
import { findBandRuns, findCoarseRuns, type ColumnRuns, type LineWidth, measureLineWidth } from './column-runs';
import { estimateInkContrast, type InkContrast } from './ink-contrast';
import type { InkSpan, InkTrace } from './ink-trace';
import { DEFAULT_PATH_COSTS, type PathCosts, type PathSeed, runReward, searchInkPath } from './path-search';
import type { InkColour, RawImage } from './raw-image';

export interface FollowInkOptions {
  /** Hours after the chart-start line to follow, e.g. chart on → chart off. Default: the whole drum turn. */
  startHours?: number;
  endHours?: number;
  /** Ink colour sampled by a click (or given in chart.json). */
  inkColour?: InkColour;
  /** A pixel on the pen line; the path is held to pass through it. */
  seed?: { xPx: number; yPx: number };
  /** Longest pen skip, in paper mm along the time direction, that is drawn across; longer ones become gaps. */
  maxBridgeMm?: number;
  costs?: Partial<PathCosts>;
}

// A typical barograph pen line is 0.3–0.5 mm wide (common practice); used only until the line is measured.
const PROVISIONAL_WIDTH_MM = 0.4;
const DEFAULT_MAX_BRIDGE_MM = 0.5;

interface PointList {
  x: number[];
  y: number[];
  confidence: number[];
  /** Time column of each point. */
  column: number[];
}

/**
 * Follows the pen line across a registered scan: scores ink against paper and grid, collects candidate
 * runs down every column, finds the globally cheapest path, and centres it to sub-pixel precision.
 */
export function followInk(image: RawImage, form: ChartForm, fit: RegistrationFit, options: FollowInkOptions = {}): InkTrace {
  const startHours = options.startHours ?? 0;
  const endHours = options.endHours ?? form.drumHours;
  const window = chartWindow(form, fit, image, startHours, endHours);
  const contrast = estimateInkContrast(image, window, { inkColour: options.inkColour, seed: options.seed });
  const provisionalWidthPx = PROVISIONAL_WIDTH_MM * window.pxPerMm;
  const costs = { ...DEFAULT_PATH_COSTS, ...options.costs };
  const seedColumn = options.seed ? Math.floor(options.seed.xPx - window.rowShift[clampRow(window, options.seed.yPx)]) - window.x0 : -1;
  const seed =
    options.seed && seedColumn >= 0 && seedColumn < window.rowTop.length
      ? { column: seedColumn, yPx: options.seed.yPx, radiusPx: 2 * provisionalWidthPx }
      : undefined;
  const band = findBand(image, window, contrast, provisionalWidthPx, costs, seed);
  const runs = findBandRuns(image, window, band.top, band.bottom, contrast, provisionalWidthPx);
  const line = measureLineWidth(runs, provisionalWidthPx);
  // Run lengths (threshold to threshold) drive the search and the steep-stroke logic; the equivalent width is reported.
  const widthPx = line.runLengthPx;
  const chosen = searchInkPath(runs, widthPx, costs, seed);

  const points: PointList = { x: [], y: [], confidence: [], column: [] };
  const gapColumns: { first: number; last: number }[] = [];
  const ticks: { x: number; y: number }[] = [];
  collectPoints(runs, window, chosen, line, points, gapColumns, ticks);

  const maxBridgePx = (options.maxBridgeMm ?? DEFAULT_MAX_BRIDGE_MM) * window.pxPerMm;
  const trace = clipToSpan(form, fit, points, startHours, endHours);
  const spans = [
    ...gapSpans(trace, gapColumns, window, maxBridgePx, (x, y) => pixelToReading(form, fit, x, y).hours, {
      startHours,
      endHours,
      bridgeHours: (options.maxBridgeMm ?? DEFAULT_MAX_BRIDGE_MM) / form.mmPerHour,
    }),
    ...offScaleSpans(form, fit, trace, line.widthPx / (window.pxPerMm * form.mmPerUnit)),
  ].sort((a, b) => a.startXPx - b.startXPx);
  return {
    xPx: Float64Array.from(trace.x),
    yPx: Float64Array.from(trace.y),
    confidence: Float32Array.from(trace.confidence),
    spans,
    timeMarks: groupTicks(ticks, line.widthPx).filter((m) => {
      const hours = pixelToReading(form, fit, m.xPx, m.yPx).hours;
      return hours >= startHours && hours <= endHours;
    }),
    lineWidthPx: line.widthPx,
    contrastMode: contrast.mode,
  };
}

/**
 * Rows to search in every column. Large scans first find the line on a sparse lattice of columns and rows
 * (a few per line width), then search only a band around that coarse path; columns where the coarse path
 * saw no ink are searched in full, so faint ink the coarse pass missed can still be found.
 */
function findBand(
  image: RawImage,
  window: ChartWindow,
  contrast: InkContrast,
  widthPx: number,
  costs: PathCosts,
  seed: PathSeed | undefined,
): { top: Int32Array; bottom: Int32Array } {
  const columnStep = Math.max(1, Math.round(1.2 * widthPx));
  const rowStep = Math.max(1, Math.round(widthPx / 2.5));
  const columns = window.rowTop.length;
  if (columnStep < 2) return { top: window.rowTop, bottom: window.rowBottom };
  const coarse = findCoarseRuns(image, window, contrast, columnStep, rowStep, widthPx);
  const coarseWidthPx = Math.max(widthPx, measureLineWidth(coarse, widthPx).runLengthPx);
  const coarseSeed = seed && { column: Math.floor(seed.column / columnStep), yPx: seed.yPx, radiusPx: seed.radiusPx + rowStep };
  const chosen = searchInkPath(coarse, coarseWidthPx, costs, coarseSeed, rowStep);
  const top = new Int32Array(columns);
  const bottom = new Int32Array(columns);
  const margin = Math.ceil(2 * widthPx + 2 * rowStep + 2);
  // Where the coarse path saw no ink, search around the nearest ink it saw on either side, widely.
  const wideMargin = margin + Math.ceil(3 * window.pxPerMm);
  const extentLow = new Float64Array(coarse.columns).fill(Infinity);
  const extentHigh = new Float64Array(coarse.columns).fill(-Infinity);
  for (let n = 0; n < coarse.columns; n++) {
    if (chosen[n] < 0) continue;
    const j = n * coarse.slots + chosen[n];
    extentLow[n] = coarse.top[j];
    extentHigh[n] = coarse.bottom[j];
  }
  const nearestLeft = new Int32Array(coarse.columns).fill(-1);
  const nearestRight = new Int32Array(coarse.columns).fill(-1);
  for (let n = 0, last = -1; n < coarse.columns; n++) {
    if (chosen[n] >= 0) last = n;
    nearestLeft[n] = last;
  }
  for (let n = coarse.columns - 1, last = -1; n >= 0; n--) {
    if (chosen[n] >= 0) last = n;
    nearestRight[n] = last;
  }
  for (let i = 0; i < columns; i++) {
    const c = Math.min(coarse.columns - 1, Math.floor(i / columnStep));
    const d = Math.min(coarse.columns - 1, c + 1);
    let low = Math.min(extentLow[c], extentLow[d]);
    let high = Math.max(extentHigh[c], extentHigh[d]);
    let pad = margin;
    // Next to a coarse gap (a pen skip, or a jump too steep for the sparse columns) reach to the ink on both sides.
    if (chosen[c] < 0 || chosen[d] < 0) {
      for (const n of [nearestLeft[c], nearestRight[d]]) {
        if (n < 0) continue;
        low = Math.min(low, extentLow[n]);
        high = Math.max(high, extentHigh[n]);
      }
      pad = wideMargin;
    }
    if (low === Infinity) {
      top[i] = window.rowTop[i];
      bottom[i] = window.rowBottom[i];
    } else {
      top[i] = Math.max(window.rowTop[i], Math.floor(low) - pad);
      bottom[i] = Math.min(window.rowBottom[i], Math.ceil(high) + pad);
    }
  }
  return { top, bottom };
}

/**
 * Turns the chosen runs into points. A run gives its centre, unless it is much longer than the line's slope
 * explains (a time mark standing on the line, or the pen moving almost vertically): then it gives the pen's way
 * through the column, in at the end nearer the previous point and out at the end nearer the next ordinary run,
 * so a jump keeps its height and a time mark is stepped over.
 */
function collectPoints(
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

function clampRow(window: ChartWindow, y: number): number {
  return Math.min(window.rowShift.length - 1, Math.max(0, Math.floor(y)));
}

/** Neighbouring tick columns belong to one stroke; its foot is their mean position. */
function groupTicks(ticks: { x: number; y: number }[], widthPx: number): { xPx: number; yPx: number }[] {
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

function clipToSpan(form: ChartForm, fit: RegistrationFit, points: PointList, startHours: number, endHours: number): PointList {
  const out: PointList = { x: [], y: [], confidence: [], column: [] };
  for (let i = 0; i < points.x.length; i++) {
    const hours = pixelToReading(form, fit, points.x[i], points.y[i]).hours;
    if (hours < startHours || hours > endHours) continue;
    out.x.push(points.x[i]);
    out.y.push(points.y[i]);
    out.confidence.push(points.confidence[i]);
    out.column.push(points.column[i]);
  }
  return out;
}

/**
 * Gap spans longer than the bridge limit, placed between the points around them. Before the first point and
 * after the last, only the part inside the asked span of hours counts (the window's corners hold no ink).
 */
function gapSpans(
  trace: PointList,
  gapColumns: { first: number; last: number }[],
  window: ChartWindow,
  maxBridgePx: number,
  hoursAt: (xPx: number, yPx: number) => number,
  span: { startHours: number; endHours: number; bridgeHours: number },
): InkSpan[] {
  const spans: InkSpan[] = [];
  const n = trace.x.length;
  for (const gap of gapColumns) {
    if (gap.last + 1 - gap.first <= maxBridgePx) continue;
    let after = trace.column.findIndex((c) => c > gap.last);
    if (after < 0) after = n;
    const before = after - 1;
    const y = n === 0 ? window.rowShift.length / 2 : before >= 0 ? trace.y[before] : trace.y[after];
    const startXPx = columnX(window, gap.first, y) - 0.5;
    const endXPx = columnX(window, gap.last, y) + 0.5;
    if (n === 0) {
      spans.push({ kind: 'gap', startXPx, endXPx, startIndex: -1, endIndex: 0 });
      continue;
    }
    if (before < 0 && hoursAt(trace.x[0], trace.y[0]) - span.startHours <= span.bridgeHours) continue;
    if (after >= n && span.endHours - hoursAt(trace.x[n - 1], trace.y[n - 1]) <= span.bridgeHours) continue;
    spans.push({ kind: 'gap', startXPx, endXPx, startIndex: before, endIndex: after });
  }
  return spans;
}

/** Runs of points whose centre lies within about half a line width of the printed range's edge. */
function offScaleSpans(form: ChartForm, fit: RegistrationFit, trace: PointList, widthUnits: number): InkSpan[] {
  const spans: InkSpan[] = [];
  const margin = 0.6 * widthUnits;
  let start = -1;
  for (let i = 0; i <= trace.x.length; i++) {
    let isOff = false;
    if (i < trace.x.length) {
      const pressure = pixelToReading(form, fit, trace.x[i], trace.y[i]).pressure;
      isOff = pressure <= form.pressureMin + margin || pressure >= form.pressureMax - margin;
    }
    if (isOff && start < 0) start = i;
    if (!isOff && start >= 0) {
      spans.push({ kind: 'off-scale', startXPx: trace.x[start], endXPx: trace.x[i - 1], startIndex: start, endIndex: i - 1 });
      start = -1;
    }
  }
  return spans;
}
