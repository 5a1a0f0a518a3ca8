import type { ChartMark, FrontNote, FrontNoteInput, FrontNoteKind } from '@shared/api/lessons';

import { normalizeInstant } from '@shared/api/parse-instant';
import { toMinuteIso } from './lesson-text';

/** A front note while it is edited: times as typed (ISO 8601 with Z), an empty end for a note at one time. */
export interface NoteDraft {
  id?: string;
  kind: FrontNoteKind;
  text: string;
  time: string;
  endTime: string;
  showDerived: boolean;
  candidateKey: string | null;
  mark: ChartMark | null;
}

export function draftOf(note: FrontNote): NoteDraft {
  return {
    id: note.id,
    kind: note.kind,
    text: note.text,
    time: toMinuteIso(note.time),
    endTime: note.endTime === null ? '' : toMinuteIso(note.endTime),
    showDerived: note.showDerived,
    candidateKey: note.candidateKey,
    mark: note.mark,
  };
}

/** A saved note as the API takes it back (without its derived values, which the server computes). */
export function inputOf(note: FrontNote): FrontNoteInput {
  const { derived: _derived, ...input } = note;
  return input;
}

/** The draft as the API takes it, or the problems of its times keyed by field. */
export function readDraft(draft: NoteDraft): { input: FrontNoteInput } | { problems: Record<string, string> } {
  const problems: Record<string, string> = {};
  const time = normalizeInstant(draft.time);
  const endTime = draft.endTime.trim() === '' ? null : normalizeInstant(draft.endTime);
  if (time === null) problems['time'] = 'ISO 8601 with Z, e.g. 2026-03-03T16:00Z';
  if (draft.endTime.trim() !== '' && endTime === null) problems['endTime'] = 'ISO 8601 with Z, or empty for a note at one time';
  if (time !== null && endTime !== null && Date.parse(endTime) < Date.parse(time)) problems['endTime'] = 'The end comes before the start.';
  if (Object.keys(problems).length > 0) return { problems };
  return {
    input: { id: draft.id, kind: draft.kind, text: draft.text.trim(), time: time as string, endTime, showDerived: draft.showDerived, candidateKey: draft.candidateKey, mark: draft.mark },
  };
}
