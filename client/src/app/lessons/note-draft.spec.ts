import { readDraft, type NoteDraft } from './note-draft';

const draft: NoteDraft = { kind: 'cold_front', text: ' The trough ', time: '2026-03-03T16:00Z', endTime: '', showDerived: true, candidateKey: null, mark: null };

describe('readDraft', () => {
  it('when the times are ISO 8601 with Z, then the note reads with UTC instants and trimmed text', () => {
    const read = readDraft(draft);

    expect(read).toEqual({ input: expect.objectContaining({ text: 'The trough', time: '2026-03-03T16:00:00.000Z', endTime: null }) });
  });

  it('when a time is written day first or the end is before the start, then each problem is named', () => {
    expect(readDraft({ ...draft, time: '03/03/2026 16:00' })).toEqual({ problems: { time: expect.any(String) } });
    expect(readDraft({ ...draft, endTime: '2026-03-03T15:00Z' })).toEqual({ problems: { endTime: 'The end comes before the start.' } });
  });
});
