import type { ChartForm } from '../chart-form';
import { pixelToReading, type RegistrationFit } from '../registration';
import { chartWindow, type ChartWindow, columnX } from './chart-window';
import { findBandRuns, measureLineWidth } from './column-runs';
import { estimateInkContrast } from './ink-contrast';
import type { InkSpan, InkTrace } from './ink-trace';
import { DEFAULT_PATH_COSTS, type PathCosts, searchInkPath } from './path-search';
import type { InkColour, RawImage } from './raw-image';
import { findBand } from './search-band';
import { collectPoints, groupTicks, type PointList } from './trace-points';

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
function clampRow(window: ChartWindow, y: number): number {
  return Math.min(window.rowShift.length - 1, Math.max(0, Math.floor(y)));
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
      spans.push({ kind: 'off_scale', startXPx: trace.x[start], endXPx: trace.x[i - 1], startIndex: start, endIndex: i - 1 });
      start = -1;
    }
  }
  return spans;
}
