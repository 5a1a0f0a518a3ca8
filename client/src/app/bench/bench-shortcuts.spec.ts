import { actionForKey, BENCH_SHORTCUTS, isTypingTarget, type KeyPress } from './bench-shortcuts';

const press = (key: string, mods: Partial<KeyPress> = {}): KeyPress => ({ key, ctrlKey: false, metaKey: false, shiftKey: false, altKey: false, ...mods });

describe('Bench shortcuts', () => {
  it.each([
    [press('2'), 'step-ink'],
    [press('f'), 'follow-ink'],
    [press('l'), 'tool-lift'],
    [press('b'), 'tool-bridge'],
    [press('u'), 'undo'],
    [press('U', { shiftKey: true }), 'redo'],
    [press('z', { ctrlKey: true }), 'undo'],
    [press('Z', { ctrlKey: true, shiftKey: true }), 'redo'],
    [press('y', { metaKey: true }), 'redo'],
    [press('?', { shiftKey: true }), 'help'],
    [press('Escape'), 'cancel'],
  ] as const)('when %o is pressed, then it asks for %s', (key, action) => {
    expect(actionForKey(key)).toBe(action);
  });

  it.each([[press('x')], [press('s', { ctrlKey: true })], [press('f', { altKey: true })]])('when %o is pressed, then the Bench leaves it alone', (key) => {
    expect(actionForKey(key)).toBeNull();
  });

  it('when the help panel lists the shortcuts, then every action a key can ask for is listed once', () => {
    const listed = BENCH_SHORTCUTS.map((shortcut) => shortcut.action);
    const keyed = ['1', '2', '3', '4', 'f', 'k', 'l', 'b', 'u', 'U', '+', '-', '0', '?', 'Escape'].map((key) => actionForKey(press(key)));

    expect(new Set(listed).size).toBe(listed.length);
    expect([...new Set(keyed)].sort()).toEqual([...listed].sort());
  });

  it('when the key press comes from a text field, then it is typing, not a shortcut', () => {
    const field = document.createElement('input');
    const button = document.createElement('button');

    expect(isTypingTarget(field)).toBe(true);
    expect(isTypingTarget(button)).toBe(false);
  });
});
