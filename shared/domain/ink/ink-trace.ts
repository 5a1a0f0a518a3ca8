import type { InkModel } from './ink-contrast';

/**
 * A span of the pen line worth naming: no ink (gap), the pen riding the edge of the printed range (off_scale), a
 * steep stroke the pen drew through from one level to another (jump), or a stroke up and back down to the line's
 * level on one arc that the line steps over (time_mark). Only gaps break the line.
 */
export type InkSpanKind = 'gap' | 'off_scale' | 'jump' | 'time_mark';

export interface InkSpan {
  kind: InkSpanKind;
  /** Pixel columns the span covers (continuous coordinates). */
  startXPx: number;
  endXPx: number;
  /**
   * Points bounding the span. Gap and time mark: the last point before it and the first after it (−1 / point
   * count when the span starts before the first point or ends after the last). Off-scale and jump: first and last
   * point inside.
   */
  startIndex: number;
  endIndex: number;
}

/**
 * The followed pen line in scan pixels (continuous coordinates), in time order, with a confidence (0–1)
 * per point. Consecutive points are joined except across a gap span.
 */
export interface InkTrace {
  xPx: Float64Array;
  yPx: Float64Array;
  confidence: Float32Array;
  spans: InkSpan[];
  /** Feet of time marks: short strokes standing off the line, found where the path stepped over them. */
  timeMarks: { xPx: number; yPx: number }[];
  /** Width of the pen line down a column, px, as measured. */
  lineWidthPx: number;
  /**
   * How ink was told from paper and grid: 'colour' (grid colour projected out), 'lab' (nearer ink than grid and
   * paper in CIELAB) or 'grey' (darker than the grid); and why that model.
   */
  contrastMode: InkModel;
  contrastReason: string;
  /** Share (0–1) of the asked span of time the line was found over (outside gap spans). */
  coverage: number;
  /** Why the result should not be trusted as a line (none found, or only a small share of the span); null when fine. */
  problem: string | null;
}

/** True when points i and i + 1 are separated by a gap span. */
export function isGapAfter(trace: InkTrace, index: number): boolean {
  return trace.spans.some((s) => s.kind === 'gap' && s.startIndex === index && s.endIndex === index + 1);
}
