/** An ISO 8601 instant with a zone (Z or ±hh:mm); seconds and fraction optional. Local times are refused. */
const INSTANT_PATTERN = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,9})?)?(Z|[+-]\d{2}:\d{2})$/;
/** An ISO 8601 calendar date, read as a UTC day. */
const DATE_PATTERN = /^\d{4}-\d{2}-\d{2}$/;

/** Epoch ms of an ISO 8601 instant with a zone, or null when it is not one. */
export function parseInstantMs(value: unknown): number | null {
  if (typeof value !== 'string' || !INSTANT_PATTERN.test(value)) return null;
  const ms = Date.parse(value);
  return Number.isNaN(ms) ? null : ms;
}

/** Epoch ms of 00:00 UTC on an ISO 8601 date (YYYY-MM-DD), or null when it is not a real date. */
export function parseUtcDateMs(value: unknown): number | null {
  if (typeof value !== 'string' || !DATE_PATTERN.test(value)) return null;
  const ms = Date.parse(`${value}T00:00:00Z`);
  // Date.parse rolls 2026-02-30 over to March; a round trip catches that.
  if (Number.isNaN(ms) || new Date(ms).toISOString().slice(0, 10) !== value) return null;
  return ms;
}
