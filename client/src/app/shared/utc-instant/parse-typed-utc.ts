/**
 * Reads a UTC time typed the usual ways: `2026-03-03 00:00`, `2026-03-03T00:00`, with or without seconds, a
 * trailing Z or an explicit offset. A time without zone is taken as UTC, because the field it is typed in says
 * UTC. Returns a full ISO 8601 UTC string, or null for anything else.
 */
export function parseTypedUtc(text: string): string | null {
  const match = /^(\d{4}-\d{2}-\d{2})[T ]+(\d{1,2}):(\d{2})(?::(\d{2}(?:\.\d+)?))?\s*(Z|UTC|[+-]\d{2}:?\d{2})?$/i.exec(text.trim());
  if (!match) return null;
  const [, date, hour, minute, second, zone] = match;
  const offset = !zone || /^(z|utc)$/i.test(zone) ? 'Z' : zone.length === 5 ? `${zone.slice(0, 3)}:${zone.slice(3)}` : zone;
  const ms = Date.parse(`${date}T${hour.padStart(2, '0')}:${minute}:${second ?? '00'}${offset}`);
  return Number.isNaN(ms) ? null : new Date(ms).toISOString();
}
