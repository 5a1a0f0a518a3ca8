import type { FollowedKnot, FollowedSpan } from '@shared/api/follow-ink';
import type { InkTrace } from '@shared/domain/ink/ink-trace';

/**
 * Thins a followed line (one point per pixel column) to knots a volunteer can handle: a knot wherever the
 * line has run `spacingPx` from the last one (so steep strokes such as a pressure jump keep their knots),
 * plus every point that bounds a span, and the last point. A knot carries the lowest confidence of the
 * points it stands for, so a weak stretch is not hidden by thinning.
 */
export function thinTrace(trace: InkTrace, spacingPx: number): { knots: FollowedKnot[]; spans: FollowedSpan[] } {
  const n = trace.xPx.length;
  const mustKeep = new Set<number>();
  for (const span of trace.spans) {
    if (span.startIndex >= 0 && span.startIndex < n) mustKeep.add(span.startIndex);
    if (span.endIndex >= 0 && span.endIndex < n) mustKeep.add(span.endIndex);
  }
  const knots: FollowedKnot[] = [];
  const knotOf = new Int32Array(n);
  let lastX = Number.NaN;
  let lastY = Number.NaN;
  let lowest = 1;
  for (let i = 0; i < n; i++) {
    lowest = Math.min(lowest, trace.confidence[i]);
    const isFirst = knots.length === 0;
    const isFar = Math.hypot(trace.xPx[i] - lastX, trace.yPx[i] - lastY) >= spacingPx;
    if (isFirst || isFar || mustKeep.has(i) || i === n - 1) {
      knots.push({ xPx: trace.xPx[i], yPx: trace.yPx[i], confidence: lowest });
      lastX = trace.xPx[i];
      lastY = trace.yPx[i];
      lowest = 1;
    }
    knotOf[i] = knots.length - 1;
  }
  const indexOf = (pointIndex: number): number => (pointIndex < 0 ? -1 : pointIndex >= n ? knots.length : knotOf[pointIndex]);
  const spans = trace.spans.map((span) => ({ kind: span.kind, fromIndex: indexOf(span.startIndex), toIndex: indexOf(span.endIndex) }));
  return { knots, spans };
}
