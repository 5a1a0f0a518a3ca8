import type { PinInput } from '@shared/api/ink-lines';
import Konva from 'konva';

import { GAP_RED, gapBracketLines } from '../../shared/plot-marks/gap-brackets';
import type { BenchKnot, ScanPoint } from '../bench-state';

// Konva draws on canvas and cannot read CSS custom properties; these match --isl-pin-amber and --isl-ink-cyan.
const PIN_AMBER = 'hsl(38, 95%, 48%)';
const INK_CYAN = 'hsl(188, 100%, 42%)';
// Doubtful stretches (dashed orange) and gaps (red brackets, drawn as in every plot), as the Look asks.
const LOW_CONFIDENCE_ORANGE = 'hsl(24, 100%, 50%)';
const OUTLINE = 'rgba(20, 30, 30, 0.85)';
// A pin off the others: the warning red of Material's error role, as a ring (amber stays the pin's own colour).
const OUTLIER_RED = 'hsl(0, 75%, 45%)';
/** Below this confidence a followed stretch is drawn as doubtful, for the volunteer to check. */
export const LOW_CONFIDENCE = 0.5;
/** Closest two followed knots' handles are drawn on screen, px; zoom in to reach the ones between. */
const HANDLE_SPACING_SCREEN_PX = 12;
/** Name of the knot shapes, so a click on one is not taken for a new knot. */
export const KNOT_NAME = 'knot';

export interface Marks {
  pins: readonly PinInput[];
  knots: readonly BenchKnot[];
  pendingPin: ScanPoint | null;
  /** Full-resolution scan px per preview px: marks are stored in scan px but drawn in preview px. */
  scanPxPerPreviewPx: number;
  /** Current zoom, so marks keep the same size on screen. */
  screenPxPerPreviewPx: number;
  /** Ink step: knots can be dragged (moved) and right-clicked (deleted). */
  areKnotsEditable: boolean;
  /** Pins off the others (by index): a red warning ring round the amber pin. */
  outlierPins: ReadonlySet<number>;
  /** Lift or Bridge: the knot picked as the stretch's first end (a ring), or null. */
  stretchStart: number | null;
}

export interface KnotEdits {
  /** A knot dropped at a new place, in preview px. */
  moved(index: number, point: { x: number; y: number }): void;
  deleted(index: number): void;
}

type SegmentStyle = 'sure' | 'doubtful' | 'gap' | 'bridge';

/**
 * How the stretch from knot i to knot i + 1 is drawn: a gap is not drawn (its ends get brackets); a bridge is
 * dotted cyan (joined on purpose, no ink read); a weak end makes it doubtful.
 */
export function segmentStyle(from: BenchKnot, to: BenchKnot): SegmentStyle {
  if (from.gapAfter) return 'gap';
  if (from.bridgeAfter) return 'bridge';
  return Math.min(from.confidence ?? 1, to.confidence ?? 1) < LOW_CONFIDENCE ? 'doubtful' : 'sure';
}

/** Replaces the layer's content with the ink line (cyan, dashed orange where doubtful, red brackets at gaps), its knots, the pins and the picked crossing. */
export function drawMarks(layer: Konva.Layer, marks: Marks, edits?: KnotEdits): void {
  layer.destroyChildren();
  const toPreview = (point: { xPx: number; yPx: number }) => ({ x: point.xPx / marks.scanPxPerPreviewPx, y: point.yPx / marks.scanPxPerPreviewPx });
  const unit = 1 / marks.screenPxPerPreviewPx;

  const knotPoints = marks.knots.map(toPreview);
  drawInkLine(layer, marks.knots, knotPoints, unit);
  // A followed line has a knot every ~0.75 mm, too close for handles at a whole-chart zoom: its handles are
  // spaced out on screen (hand-placed knots and knots at a gap always get one), and zooming in shows the rest.
  let lastHandle: { x: number; y: number } | null = null;
  knotPoints.forEach((point, index) => {
    const source = marks.knots[index];
    const isFollowed = source.confidence !== undefined;
    const bordersGap = source.gapAfter === true || (index > 0 && marks.knots[index - 1].gapAfter === true);
    const isCrowded = lastHandle !== null && Math.hypot(point.x - lastHandle.x, point.y - lastHandle.y) < HANDLE_SPACING_SCREEN_PX * unit;
    if (isFollowed && !bordersGap && isCrowded && index !== knotPoints.length - 1) return;
    lastHandle = point;
    const knot = new Konva.Circle({
      name: KNOT_NAME,
      x: point.x,
      y: point.y,
      radius: (isFollowed ? 3 : 3.5) * unit,
      fill: isFollowed ? 'white' : INK_CYAN,
      stroke: isFollowed ? INK_CYAN : OUTLINE,
      strokeWidth: unit,
      draggable: marks.areKnotsEditable,
      listening: marks.areKnotsEditable,
      hitStrokeWidth: 6 * unit,
    });
    if (marks.areKnotsEditable && edits) {
      knot.on('dragend', () => edits.moved(index, { x: knot.x(), y: knot.y() }));
      knot.on('contextmenu', (event) => {
        event.evt.preventDefault();
        edits.deleted(index);
      });
    }
    layer.add(knot);
  });

  if (marks.stretchStart !== null && knotPoints[marks.stretchStart]) {
    const point = knotPoints[marks.stretchStart];
    layer.add(new Konva.Circle({ x: point.x, y: point.y, radius: 8 * unit, stroke: INK_CYAN, strokeWidth: 2.5 * unit, listening: false }));
  }

  marks.pins.forEach((pin, index) => {
    const point = toPreview(pin);
    if (marks.outlierPins.has(index)) {
      layer.add(new Konva.Circle({ x: point.x, y: point.y, radius: 10 * unit, stroke: OUTLIER_RED, strokeWidth: 2.5 * unit, listening: false }));
    }
    layer.add(new Konva.Circle({ x: point.x, y: point.y, radius: 6 * unit, fill: PIN_AMBER, stroke: OUTLINE, strokeWidth: unit, listening: false }));
    layer.add(new Konva.Text({ x: point.x + 8 * unit, y: point.y - 16 * unit, text: String(index + 1), fontSize: 13 * unit, fontStyle: 'bold', fill: OUTLINE, listening: false }));
  });

  if (marks.pendingPin) {
    const point = toPreview(marks.pendingPin);
    layer.add(new Konva.Circle({ x: point.x, y: point.y, radius: 9 * unit, stroke: PIN_AMBER, strokeWidth: 2.5 * unit, dash: [4 * unit, 3 * unit], listening: false }));
    layer.add(new Konva.Line({ points: [point.x - 14 * unit, point.y, point.x + 14 * unit, point.y], stroke: PIN_AMBER, strokeWidth: unit, listening: false }));
    layer.add(new Konva.Line({ points: [point.x, point.y - 14 * unit, point.x, point.y + 14 * unit], stroke: PIN_AMBER, strokeWidth: unit, listening: false }));
  }
  layer.batchDraw();
}

/** Draws the line as runs of one style each (a few long lines instead of one per knot), and a bracket at each end of a gap. */
function drawInkLine(layer: Konva.Layer, knots: readonly BenchKnot[], points: { x: number; y: number }[], unit: number): void {
  let runStart = 0;
  for (let i = 0; i < knots.length - 1; i++) {
    const style = segmentStyle(knots[i], knots[i + 1]);
    const nextStyle = i + 1 < knots.length - 1 ? segmentStyle(knots[i + 1], knots[i + 2]) : null;
    if (style === nextStyle) continue;
    if (style === 'gap') drawGapBrackets(layer, points[i], points[i + 1], unit);
    else {
      const run = points.slice(runStart, i + 2).flatMap((p) => [p.x, p.y]);
      layer.add(
        new Konva.Line({
          points: run,
          stroke: style === 'doubtful' ? LOW_CONFIDENCE_ORANGE : INK_CYAN,
          strokeWidth: 2 * unit,
          dash: style === 'doubtful' ? [6 * unit, 4 * unit] : style === 'bridge' ? [1.5 * unit, 3 * unit] : undefined,
          lineJoin: 'round',
          lineCap: 'round',
          listening: false,
        }),
      );
    }
    runStart = i + 1;
  }
}

/** "[" just after the knot before a gap and "]" just before the knot after it. */
function drawGapBrackets(layer: Konva.Layer, before: { x: number; y: number }, after: { x: number; y: number }, unit: number): void {
  for (const points of gapBracketLines(before, after, unit)) layer.add(new Konva.Line({ points, stroke: GAP_RED, strokeWidth: 2 * unit, listening: false }));
}
