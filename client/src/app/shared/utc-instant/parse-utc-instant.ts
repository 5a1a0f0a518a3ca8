/**
 * Reads an instant typed as ISO 8601 with an explicit Z or offset (`2026-03-02T00:00Z`) and returns it as a
 * full ISO 8601 UTC string; null for anything else. A bare local time is refused because the browser would
 * read it in its own zone.
 */
export function parseUtcInstant(text: string): string | null {
  const trimmed = text.trim();
  if (!/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/i.test(trimmed)) return null;
  const ms = Date.parse(trimmed);
  return Number.isNaN(ms) ? null : new Date(ms).toISOString();
}
