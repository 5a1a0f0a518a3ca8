import { EMPTY_HISTORY, type EditHistory, recordChange, redoChange, undoChange } from './edit-history';

describe('edit history (Undo and Redo)', () => {
  const afterTwoChanges = recordChange(recordChange<string>(EMPTY_HISTORY, 'a', 50), 'b', 50);

  it('when two changes are undone and one redone, then the states come back in order', () => {
    const first = undoChange(afterTwoChanges, 'c')!;
    const second = undoChange(first.history, first.state)!;
    const redone = redoChange(second.history, second.state)!;

    expect([first.state, second.state, redone.state]).toEqual(['b', 'a', 'b']);
    expect(redone.history).toEqual({ past: ['a'], future: ['c'] });
  });

  it('when a change comes after an undo, then there is nothing left to redo', () => {
    const undone = undoChange(afterTwoChanges, 'c')!;

    const changed = recordChange(undone.history, undone.state, 50);

    expect(redoChange(changed, 'd')).toBeNull();
    expect(changed.past).toEqual(['a', 'b']);
  });

  it('when nothing was changed or undone, then undo and redo give nothing', () => {
    const empty: EditHistory<string> = EMPTY_HISTORY;

    expect(undoChange(empty, 'x')).toBeNull();
    expect(redoChange(empty, 'x')).toBeNull();
  });

  it('when more changes are made than the depth, then the oldest are forgotten', () => {
    let history: EditHistory<number> = EMPTY_HISTORY;
    for (let i = 0; i < 5; i++) history = recordChange(history, i, 3);

    expect(history.past).toEqual([2, 3, 4]);
  });
});
