/** Everything on the Bench that a key can do. */
export type BenchAction =
  | 'step-pin'
  | 'step-ink'
  | 'step-marks'
  | 'step-proof'
  | 'follow-ink'
  | 'tool-knot'
  | 'tool-lift'
  | 'tool-bridge'
  | 'undo'
  | 'redo'
  | 'zoom-in'
  | 'zoom-out'
  | 'zoom-fit'
  | 'help'
  | 'cancel';

/** A key press as the Bench reads it (the fields of KeyboardEvent it looks at). */
export interface KeyPress {
  key: string;
  ctrlKey: boolean;
  metaKey: boolean;
  shiftKey: boolean;
  altKey: boolean;
}

/** The shortcuts as the help panel lists them: the keys to press and what they do. */
export const BENCH_SHORTCUTS: readonly { action: BenchAction; keys: string; does: string }[] = [
  { action: 'step-pin', keys: '1', does: 'Pin step' },
  { action: 'step-ink', keys: '2', does: 'Ink step' },
  { action: 'step-marks', keys: '3', does: 'Marks step' },
  { action: 'step-proof', keys: '4', does: 'Proof step' },
  { action: 'follow-ink', keys: 'F', does: 'Follow ink (Ink step)' },
  { action: 'tool-knot', keys: 'K', does: 'Knot tool: a click adds a knot (Ink step)' },
  { action: 'tool-lift', keys: 'L', does: 'Lift tool: two knots, no ink between (Ink step)' },
  { action: 'tool-bridge', keys: 'B', does: 'Bridge tool: two knots, joined on purpose (Ink step)' },
  { action: 'undo', keys: 'U · Ctrl+Z', does: 'Undo the last change to the line' },
  { action: 'redo', keys: '⇧U · Ctrl+⇧Z · Ctrl+Y', does: 'Redo' },
  { action: 'zoom-in', keys: '+', does: 'Zoom in' },
  { action: 'zoom-out', keys: '−', does: 'Zoom out' },
  { action: 'zoom-fit', keys: '0', does: 'Fit the scan' },
  { action: 'help', keys: '?', does: 'Show or hide this list' },
  { action: 'cancel', keys: 'Esc', does: 'Drop a half-picked crossing or stretch; close this list' },
];

const PLAIN_KEYS: Readonly<Record<string, BenchAction>> = {
  '1': 'step-pin',
  '2': 'step-ink',
  '3': 'step-marks',
  '4': 'step-proof',
  f: 'follow-ink',
  k: 'tool-knot',
  l: 'tool-lift',
  b: 'tool-bridge',
  u: 'undo',
  U: 'redo',
  '+': 'zoom-in',
  '=': 'zoom-in',
  '-': 'zoom-out',
  '0': 'zoom-fit',
  '?': 'help',
  Escape: 'cancel',
};

/** The action a key press asks for, or null for a key the Bench leaves alone (Alt combinations always). */
export function actionForKey(press: KeyPress): BenchAction | null {
  if (press.altKey) return null;
  if (press.ctrlKey || press.metaKey) {
    const key = press.key.toLowerCase();
    if (key === 'z') return press.shiftKey ? 'redo' : 'undo';
    if (key === 'y') return 'redo';
    return null;
  }
  return PLAIN_KEYS[press.key] ?? null;
}

/** True when a key press belongs to a field being typed in (the Bench's shortcuts then stay out of its way). */
export function isTypingTarget(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  return target.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(target.tagName) || target.getAttribute('role') === 'combobox';
}
