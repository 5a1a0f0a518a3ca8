/**
 * The one reader of instants, days and ids typed by people or sent on the wire (server routes, the
 * client's forms and the chart file all use it).
 *
 * An instant is a calendar date and a time of day, year first (ISO 8601 order), with `T` or a space
 * between them: `2026-03-03T00:00Z`, `2026-03-03 00:00`, `2026-03-03T01:00:30+01:00`. Seconds and a
 * fraction are optional; the zone is `Z`, `UTC`, `GMT` or an offset (`+01:00`, `+0100`, `+01`), and an
 * instant without one is UTC, because every time field of Isallo is labelled UTC. Forms that people read
 * two ways (`03/04/2026`: 3 April or March 4?) and dates that do not exist are refused with a reason.
 */

export type InstantReading = { ok: true; ms: number } | { ok: false; problem: string };

/** What a good instant looks like, for messages. */
export const INSTANT_EXAMPLE = 'e.g. 2026-03-03T00:00Z or 2026-03-03 00:00 (UTC)';

const INSTANT_PATTERN =
  /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,9}))?)?\s*(Z|UTC|GMT|[+-]\d{2}(?::?\d{2})?)?$/i;
const DATE_PATTERN = /^(\d{4})-(\d{2})-(\d{2})$/;
/** Day and month in either order with a short or long year: 03/04/2026, 3.4.26, 04-03-2026. */
const DAY_MONTH_PATTERN = /^\d{1,2}[/.-]\d{1,2}[/.-]\d{2,4}\b/;
const UUID_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Reads an instant; `allowDate` also takes a bare date as 00:00 UTC of that day (for filters and ranges). */
export function readInstant(value: unknown, { allowDate = false } = {}): InstantReading {
  if (typeof value !== 'string' || value.trim() === '') return { ok: false, problem: `must be a date and time, ${INSTANT_EXAMPLE}` };
  const text = value.trim();
  if (DAY_MONTH_PATTERN.test(text)) {
    return { ok: false, problem: `"${text}" can be read with day and month either way round; write the year first, ${INSTANT_EXAMPLE}` };
  }
  const date = DATE_PATTERN.exec(text);
  if (date) {
    if (!allowDate) return { ok: false, problem: `needs a time of day as well as the date, ${INSTANT_EXAMPLE}` };
    const ms = utcMs(Number(date[1]), Number(date[2]), Number(date[3]), 0, 0, 0, 0);
    return ms === null ? notReal(text) : { ok: true, ms };
  }
  const match = INSTANT_PATTERN.exec(text);
  if (!match) return { ok: false, problem: `must be a date and time, ${INSTANT_EXAMPLE}` };
  const [, year, month, day, hour, minute, second = '0', fraction = '', zone = 'Z'] = match;
  const millis = Number(`0.${fraction || '0'}`) * 1000;
  const localMs = utcMs(Number(year), Number(month), Number(day), Number(hour), Number(minute), Number(second), Math.floor(millis));
  const offsetMinutes = zoneOffsetMinutes(zone);
  if (localMs === null || offsetMinutes === null) return notReal(text);
  return { ok: true, ms: localMs - offsetMinutes * 60_000 };
}

/** Epoch ms of an instant, or null when it is not one. */
export function parseInstantMs(value: unknown): number | null {
  const reading = readInstant(value);
  return reading.ok ? reading.ms : null;
}

/** The full ISO 8601 UTC string of an instant (`2026-03-03T00:00:00.000Z`), or null when it is not one. */
export function normalizeInstant(value: unknown): string | null {
  const ms = parseInstantMs(value);
  return ms === null ? null : new Date(ms).toISOString();
}

/** Epoch ms of 00:00 UTC on a real calendar date YYYY-MM-DD, or null. */
export function parseUtcDateMs(value: unknown): number | null {
  if (typeof value !== 'string') return null;
  const date = DATE_PATTERN.exec(value);
  return date ? utcMs(Number(date[1]), Number(date[2]), Number(date[3]), 0, 0, 0, 0) : null;
}

/** True for a real calendar date YYYY-MM-DD (2026-02-30 is not). */
export function isCalendarDate(value: unknown): value is string {
  return parseUtcDateMs(value) !== null;
}

/** True for an id as the API makes them (a UUID). */
export function isId(value: unknown): value is string {
  return typeof value === 'string' && UUID_PATTERN.test(value);
}

function notReal(text: string): InstantReading {
  return { ok: false, problem: `"${text}" is not a real date and time` };
}

/** Epoch ms of the fields read as UTC, or null when a field is out of its range (month 13, 30 February, 24:00). */
function utcMs(year: number, month: number, day: number, hour: number, minute: number, second: number, millis: number): number | null {
  if (month < 1 || month > 12 || hour > 23 || minute > 59 || second > 59) return null;
  const ms = Date.UTC(year, month - 1, day, hour, minute, second, millis);
  // Date.UTC rolls 30 February over to March; reading the day back catches that.
  const back = new Date(ms);
  if (back.getUTCFullYear() !== year || back.getUTCMonth() !== month - 1 || back.getUTCDate() !== day) return null;
  return ms;
}

/** Minutes east of UTC, or null for an offset beyond ±18:00 (the ISO 8601 / ECMAScript limit). */
function zoneOffsetMinutes(zone: string): number | null {
  if (/^(Z|UTC|GMT)$/i.test(zone)) return 0;
  const sign = zone.startsWith('-') ? -1 : 1;
  const digits = zone.slice(1).replace(':', '');
  const hours = Number(digits.slice(0, 2));
  const minutes = digits.length > 2 ? Number(digits.slice(2)) : 0;
  if (minutes > 59 || hours * 60 + minutes > 18 * 60) return null;
  return sign * (hours * 60 + minutes);
}
