import type { ChartForm } from '../chart-form';
import { pixelToReading, type RegistrationFit } from '../registration';
import { chartWindow, type ChartWindow, columnX } from './chart-window';
import { findBandRuns, measureLineWidth } from './column-runs';
import { estimateInkContrast } from './ink-contrast';
import type { InkSpan, InkTrace } from './ink-trace';
import { DEFAULT_PATH_COSTS, type PathCosts, searchInkPath } from './path-search';
import type { InkColour, RawImage } from './raw-image';
import { findBand } from './search-band';
import { adaptRunsToLocalStrength } from './local-strength';
import { pixelScorer } from './pixel-score';
import { collectPoints, groupTicks, type PointList, type TickFoot } from './trace-points';

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
const LAB_STRENGTH_DEAD_ZONE = 0.3;
// Reach (paper mm of time either side) over which the ink's local strength is taken.
const LOCAL_STRENGTH_REACH_MM = 4;

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
  // The lab score of faded like-coloured ink wavers more from column to column (its nearness weight), so a wider
  // change of strength passes as the same line.
  const modelCosts = contrast.mode === 'lab' ? { strengthDeadZone: LAB_STRENGTH_DEAD_ZONE } : {};
  const costs = { ...DEFAULT_PATH_COSTS, ...modelCosts, ...options.costs };
  const seedColumn = options.seed ? Math.floor(options.seed.xPx - window.rowShift[clampRow(window, options.seed.yPx)]) - window.x0 : -1;
  const seed =
    options.seed && seedColumn >= 0 && seedColumn < window.rowTop.length
      ? { column: seedColumn, yPx: options.seed.yPx, radiusPx: 2 * provisionalWidthPx }
      : undefined;
  const localReachPx = LOCAL_STRENGTH_REACH_MM * window.pxPerMm;
  const band = findBand(image, window, contrast, provisionalWidthPx, costs, seed, localReachPx);
  const runs = findBandRuns(image, window, band.top, band.bottom, contrast, provisionalWidthPx);
  // Faded stretches of like-coloured ink score far below full ink; the lab model judges them against the ink nearby.
  if (contrast.mode === 'lab') adaptRunsToLocalStrength(runs, localReachPx, contrast.threshold);
  const line = measureLineWidth(runs, provisionalWidthPx);
  // Run lengths (threshold to threshold) drive the search and the steep-stroke logic; the equivalent width is reported.
  const widthPx = line.runLengthPx;
  const chosen = searchInkPath(runs, widthPx, costs, seed);

  const points: PointList = { x: [], y: [], confidence: [], column: [], stroke: [] };
  const gapColumns: { first: number; last: number }[] = [];
  const ticks: TickFoot[] = [];
  collectPoints(runs, window, chosen, line, points, gapColumns, ticks, { score: pixelScorer(image, contrast), threshold: contrast.threshold });

  const maxBridgePx = (options.maxBridgeMm ?? DEFAULT_MAX_BRIDGE_MM) * window.pxPerMm;
  const trace = clipToSpan(form, fit, points, startHours, endHours);
  const timeMarks = groupTicks(ticks, line.widthPx).filter((m) => {
    const hours = pixelToReading(form, fit, m.xPx, m.yPx).hours;
    return hours >= startHours && hours <= endHours;
  });
  const spans = [
    ...gapSpans(trace, gapColumns, window, maxBridgePx, (x, y) => pixelToReading(form, fit, x, y).hours, {
      startHours,
      endHours,
      bridgeHours: (options.maxBridgeMm ?? DEFAULT_MAX_BRIDGE_MM) / form.mmPerHour,
    }),
    ...offScaleSpans(form, fit, trace, line.widthPx / (window.pxPerMm * form.mmPerUnit)),
    ...jumpSpans(trace),
    ...timeMarkSpans(trace, timeMarks, line.widthPx),
  ].sort((a, b) => a.startXPx - b.startXPx);
  const gapPx = spans.filter((s) => s.kind === 'gap').reduce((sum, s) => sum + Math.max(0, s.endXPx - s.startXPx), 0);
  const coverage = trace.x.length === 0 ? 0 : Math.max(0, Math.min(1, 1 - gapPx / Math.max(1, window.x1 - window.x0)));
  return {
    coverage,
    problem: problemOf(trace.x.length, coverage, contrast.reason),
    xPx: Float64Array.from(trace.x),
    yPx: Float64Array.from(trace.y),
    confidence: Float32Array.from(trace.confidence),
    spans,
    timeMarks: timeMarks.map((m) => ({ xPx: m.xPx, yPx: m.yPx })),
    lineWidthPx: line.widthPx,
    contrastMode: contrast.mode,
    contrastReason: contrast.reason,
  };
}
/** Below this share of the span found, Follow ink says the line was mostly not found. */
export const MIN_COVERAGE = 0.5;

function problemOf(points: number, coverage: number, reason: string): string | null {
  if (points === 0) return `No pen line was found in the chart span (${reason}). Check the pins, or click on the line to give its colour.`;
  if (coverage < MIN_COVERAGE) {
    return `The pen line was found over only ${Math.round(100 * coverage)} % of the chart span (${reason}). Check the pins, or click on the line to give its colour.`;
  }
  return null;
}

function clampRow(window: ChartWindow, y: number): number {
  return Math.min(window.rowShift.length - 1, Math.max(0, Math.floor(y)));
}

function clipToSpan(form: ChartForm, fit: RegistrationFit, points: PointList, startHours: number, endHours: number): PointList {
  const out: PointList = { x: [], y: [], confidence: [], column: [], stroke: [] };
  for (let i = 0; i < points.x.length; i++) {
    const hours = pixelToReading(form, fit, points.x[i], points.y[i]).hours;
    if (hours < startHours || hours > endHours) continue;
    out.x.push(points.x[i]);
    out.y.push(points.y[i]);
    out.confidence.push(points.confidence[i]);
    out.column.push(points.column[i]);
    out.stroke.push(points.stroke[i]);
  }
  return out;
}

/** Each steep stroke followed across its width (a jump), from its first point to its last. */
function jumpSpans(trace: PointList): InkSpan[] {
  const spans: InkSpan[] = [];
  for (let i = 0; i < trace.stroke.length; i++) {
    const stroke = trace.stroke[i];
    if (stroke === 0 || (i > 0 && trace.stroke[i - 1] === stroke)) continue;
    let last = i;
    while (last + 1 < trace.stroke.length && trace.stroke[last + 1] === stroke) last++;
    spans.push({ kind: 'jump', startXPx: trace.x[i], endXPx: trace.x[last], startIndex: i, endIndex: last });
  }
  return spans;
}

/** Each time mark the line stepped over, between the last point before its stroke and the first after it. */
function timeMarkSpans(trace: PointList, marks: { xPx: number; column: number }[], widthPx: number): InkSpan[] {
  const reach = widthPx / 2 + 1;
  return marks.map((mark) => {
    let after = trace.column.findIndex((c) => c > mark.column + reach);
    if (after < 0) after = trace.column.length;
    let before = after - 1;
    while (before >= 0 && trace.column[before] >= mark.column - reach) before--;
    return { kind: 'time_mark', startXPx: mark.xPx - reach, endXPx: mark.xPx + reach, startIndex: before, endIndex: after };
  });
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
      spans.push({ kind: 'off_scale', startXPx: trace.x[start], endXPx: trace.x[i - 1], startIndex: start, endIndex: i - 1 });
      start = -1;
    }
  }
  return spans;
}
