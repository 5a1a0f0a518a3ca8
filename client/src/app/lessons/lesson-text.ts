import { FRONT_NOTE_KIND_LABELS, type FrontNoteKind, type NoteDerivedValues } from '@shared/api/lessons';

const WEEKDAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** An instant as "Tue 3 Mar 2026 16:00 UTC". */
export function formatUtc(iso: string): string {
  const date = new Date(iso);
  const hh = String(date.getUTCHours()).padStart(2, '0');
  const mm = String(date.getUTCMinutes()).padStart(2, '0');
  return `${WEEKDAYS[date.getUTCDay()]} ${date.getUTCDate()} ${MONTHS[date.getUTCMonth()]} ${date.getUTCFullYear()} ${hh}:${mm} UTC`;
}

/** An instant as typed in the note form: ISO 8601 to the minute with Z (`2026-03-03T16:00Z`). */
export function toMinuteIso(iso: string): string {
  return `${new Date(iso).toISOString().slice(0, 16)}Z`;
}

/** When a note is: its time, or its span. */
export function noteWhen(note: { time: string; endTime: string | null }): string {
  return note.endTime === null ? formatUtc(note.time) : `${formatUtc(note.time)} to ${formatUtc(note.endTime)}`;
}

function signed(value: number, digits: number): string {
  const text = Math.abs(value).toFixed(digits);
  return value > 0 ? `+${text}` : value < 0 ? `−${text}` : text;
}

/**
 * The derived values as one line: "3-hour tendency +1.8 hPa, characteristic 3 (5 3 018); rise 7.5 hPa in 3 h,
 * 2.5 hPa/h". Parts the series does not support are left out; empty when none is known.
 */
export function derivedText(derived: NoteDerivedValues | null): string {
  if (!derived) return '';
  const parts: string[] = [];
  if (derived.tendency) {
    parts.push(`3-hour tendency ${signed(derived.tendency.amountHpa, 1)} hPa, characteristic ${derived.tendency.characteristic} (group ${derived.tendency.group})`);
  }
  if (derived.change) {
    const hours = (Date.parse(derived.change.toTime) - Date.parse(derived.change.fromTime)) / 3_600_000;
    const word = derived.change.changeHpa >= 0 ? 'rise' : 'fall';
    parts.push(`${word} ${Math.abs(derived.change.changeHpa).toFixed(1)} hPa in ${Number(hours.toFixed(1))} h, ${signed(derived.change.rateHpaPerHour, 2)} hPa/h`);
  }
  return parts.join('; ');
}

export function kindLabel(kind: FrontNoteKind): string {
  return FRONT_NOTE_KIND_LABELS[kind];
}

/**
 * The text alternative of the plot and the chart images: what they show, then the notes in time order
 * (kind, when, text), so a screen reader hears the lesson the picture tells.
 */
export function passageAltText(
  what: string,
  notes: readonly { kind: FrontNoteKind; time: string; endTime: string | null; text: string }[],
): string {
  const ordered = notes.slice().sort((a, b) => Date.parse(a.time) - Date.parse(b.time));
  if (ordered.length === 0) return `${what}. No notes yet.`;
  const lines = ordered.map((note) => `${kindLabel(note.kind)}, ${noteWhen(note)}${note.text ? `: ${note.text}` : ''}`);
  return `${what}. Notes in time order: ${lines.join('. ')}.`;
}
