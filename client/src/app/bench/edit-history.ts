/**
 * Undo and Redo over one value (the Bench's knot list): the states before the current one, newest last, and
 * the states undone, next to redo last. Immutable, so it sits in a signal; a new change drops the redo side.
 */
export interface EditHistory<T> {
  readonly past: readonly T[];
  readonly future: readonly T[];
}

export const EMPTY_HISTORY: EditHistory<never> = { past: [], future: [] };

/** A change from `before` to a new state: `before` joins the past (at most `depth` kept) and Redo is cleared. */
export function recordChange<T>(history: EditHistory<T>, before: T, depth: number): EditHistory<T> {
  return { past: [...history.past, before].slice(-depth), future: [] };
}

/** Steps back from `current`: the state to show and the history after; null when there is nothing to undo. */
export function undoChange<T>(history: EditHistory<T>, current: T): { state: T; history: EditHistory<T> } | null {
  if (history.past.length === 0) return null;
  return { state: history.past[history.past.length - 1], history: { past: history.past.slice(0, -1), future: [...history.future, current] } };
}

/** Steps forward again from `current`; null when nothing was undone (or a change came after the undo). */
export function redoChange<T>(history: EditHistory<T>, current: T): { state: T; history: EditHistory<T> } | null {
  if (history.future.length === 0) return null;
  return { state: history.future[history.future.length - 1], history: { past: [...history.past, current], future: history.future.slice(0, -1) } };
}
