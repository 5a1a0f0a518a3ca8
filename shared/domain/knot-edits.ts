import type { WorkKnot } from '../api/bench-work';

/**
 * Lift and bridge on the Bench's knot list (knots in time order, scan px). Both take the stretch between
 * two knots: the knots inside it go, and the first knot says what the stretch is. A lift is a pen gap
 * (no ink: a gap in the series); a bridge joins a short skip on purpose (its points flagged interpolated).
 */

/** Marks the stretch from knot `a` to knot `b` (either order) as no ink: the knots between go, a gap follows the first. */
export function liftStretch(knots: readonly WorkKnot[], a: number, b: number): readonly WorkKnot[] {
  return markStretch(knots, a, b, { gapAfter: true });
}

/** Joins knot `a` to knot `b` (either order) on purpose: the knots between go, a bridge follows the first (and any gap there closes). */
export function bridgeStretch(knots: readonly WorkKnot[], a: number, b: number): readonly WorkKnot[] {
  return markStretch(knots, a, b, { bridgeAfter: true });
}

/** Index of the knot nearest a point (scan px), or null for an empty line. */
export function nearestKnotIndex(knots: readonly WorkKnot[], point: { xPx: number; yPx: number }): number | null {
  let bestIndex: number | null = null;
  let bestDistance = Number.POSITIVE_INFINITY;
  knots.forEach((knot, index) => {
    const distance = Math.hypot(knot.xPx - point.xPx, knot.yPx - point.yPx);
    if (distance < bestDistance) {
      bestIndex = index;
      bestDistance = distance;
    }
  });
  return bestIndex;
}

function markStretch(knots: readonly WorkKnot[], a: number, b: number, kind: { gapAfter: true } | { bridgeAfter: true }): readonly WorkKnot[] {
  const from = Math.min(a, b);
  const to = Math.max(a, b);
  // A stretch needs two different knots of the line; anything else changes nothing (and so leaves no Undo step).
  if (from === to || from < 0 || to >= knots.length) return knots;
  const first = knots[from];
  // The two marks exclude each other: a lifted stretch has no ink to interpolate, a bridged one is not a gap.
  const { gapAfter: _gap, bridgeAfter: _bridge, ...plain } = first;
  return [...knots.slice(0, from), { ...plain, ...kind }, ...knots.slice(to)];
}
