import type { ChartForm } from '../chart-form';
import { pixelToReading, type RegistrationFit } from '../registration';
import { chartWindow } from './chart-window';
import { findColumnRuns, measureLineWidthPx, type ColumnRuns } from './column-runs';
import { estimateInkContrast } from './ink-contrast';
import type { InkSpan, InkTrace } from './ink-trace';
import { DEFAULT_PATH_COSTS, type PathCosts, runReward, searchInkPath } from './path-search';
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
  const runs = findColumnRuns(image, window, contrast, provisionalWidthPx);
  const widthPx = measureLineWidthPx(runs, provisionalWidthPx);
  let rowMin = image.height;
  let rowMax = 0;
  for (let i = 0; i < window.rowTop.length; i++) {
    rowMin = Math.min(rowMin, window.rowTop[i]);
    rowMax = Math.max(rowMax, window.rowBottom[i]);
  }
  const seed =
    options.seed && options.seed.xPx >= window.x0 && options.seed.xPx < window.x1
      ? { column: Math.floor(options.seed.xPx) - window.x0, yPx: options.seed.yPx, radiusPx: 2 * widthPx }
      : undefined;
  const chosen = searchInkPath(runs, rowMin, rowMax, widthPx, { ...DEFAULT_PATH_COSTS, ...options.costs }, seed);

  const points: PointList = { x: [], y: [], confidence: [] };
  const gapColumns: { first: number; last: number }[] = [];
  collectPoints(runs, chosen, widthPx, points, gapColumns);

  const maxBridgePx = (options.maxBridgeMm ?? DEFAULT_MAX_BRIDGE_MM) * window.pxPerMm;
  const trace = clipToSpan(form, fit, points, startHours, endHours);
  const spans = [
    ...gapSpans(trace, gapColumns, runs.x0, maxBridgePx, (x, y) => pixelToReading(form, fit, x, y).hours, {
      startHours,
      endHours,
      bridgeHours: (options.maxBridgeMm ?? DEFAULT_MAX_BRIDGE_MM) / form.mmPerHour,
    }),
    ...offScaleSpans(form, fit, trace, widthPx / (window.pxPerMm * form.mmPerUnit)),
  ].sort((a, b) => a.startXPx - b.startXPx);
  return {
    xPx: Float64Array.from(trace.x),
    yPx: Float64Array.from(trace.y),
    confidence: Float32Array.from(trace.confidence),
    spans,
    lineWidthPx: widthPx,
    contrastMode: contrast.mode,
  };
}

/**
 * Turns the chosen runs into points. A short run gives its centre. A long run (the pen moving steeply, or a
 * time mark standing on the line) gives the pen's way through the column: in at the end nearer the previous
 * point, out at the end nearer the next run, so a jump keeps its height and a time mark is stepped over.
 */
function collectPoints(runs: ColumnRuns, chosen: Int16Array, widthPx: number, points: PointList, gapColumns: { first: number; last: number }[]): void {
  const { slots } = runs;
  const half = widthPx / 2;
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
    const x = runs.x0 + i + 0.5;
    const confidence = confidenceOf(runs, i, k, widthPx);
    const top = runs.top[j];
    const bottom = runs.bottom[j];
    if (!isLong(runs, i, k, widthPx)) {
      points.x.push(x);
      points.y.push(runs.centre[j]);
      points.confidence.push(confidence);
      lastY = runs.centre[j];
      continue;
    }
    const upper = top + half;
    const lower = bottom - half;
    // Where the pen goes after this steep stretch: the first short run past it (or back where it came from).
    let after = i + 1;
    while (after < runs.columns && chosen[after] >= 0 && isLong(runs, after, chosen[after], widthPx)) after++;
    const previousY = Number.isNaN(lastY) ? (upper + lower) / 2 : lastY;
    const nextY = after < runs.columns && chosen[after] >= 0 ? runs.centre[after * slots + chosen[after]] : previousY;
    const entryY = Math.abs(previousY - upper) < Math.abs(previousY - lower) ? upper : lower;
    const exitY = Math.abs(nextY - upper) < Math.abs(nextY - lower) ? upper : lower;
    points.x.push(x);
    points.y.push(entryY);
    points.confidence.push(confidence);
    if (exitY !== entryY) {
      points.x.push(x);
      points.y.push(exitY);
      points.confidence.push(confidence);
    }
    lastY = exitY;
  }
  if (gapStart >= 0) gapColumns.push({ first: gapStart, last: runs.columns - 1 });
}

function isLong(runs: ColumnRuns, i: number, k: number, widthPx: number): boolean {
  const j = i * runs.slots + k;
  return runs.bottom[j] - runs.top[j] > 2.2 * widthPx;
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

function clipToSpan(form: ChartForm, fit: RegistrationFit, points: PointList, startHours: number, endHours: number): PointList & { column: number[] } {
  const out: PointList & { column: number[] } = { x: [], y: [], confidence: [], column: [] };
  for (let i = 0; i < points.x.length; i++) {
    const hours = pixelToReading(form, fit, points.x[i], points.y[i]).hours;
    if (hours < startHours || hours > endHours) continue;
    out.x.push(points.x[i]);
    out.y.push(points.y[i]);
    out.confidence.push(points.confidence[i]);
    out.column.push(Math.floor(points.x[i]));
  }
  return out;
}

/**
 * Gap spans longer than the bridge limit, placed between the points around them. Before the first point and
 * after the last, only the part inside the asked span of hours counts (the window's corners hold no ink).
 */
function gapSpans(
  trace: PointList & { column: number[] },
  gapColumns: { first: number; last: number }[],
  x0: number,
  maxBridgePx: number,
  hoursAt: (xPx: number, yPx: number) => number,
  span: { startHours: number; endHours: number; bridgeHours: number },
): InkSpan[] {
  const spans: InkSpan[] = [];
  const n = trace.x.length;
  for (const gap of gapColumns) {
    const startXPx = x0 + gap.first;
    const endXPx = x0 + gap.last + 1;
    if (endXPx - startXPx <= maxBridgePx) continue;
    let after = trace.column.findIndex((c) => c > x0 + gap.last);
    if (after < 0) after = n;
    const before = after - 1;
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
