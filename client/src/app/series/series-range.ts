const DAY_MS = 24 * 60 * 60 * 1000;

/** A station series request: the station and the UTC days from and to, both included. */
export interface SeriesRange {
  stationId: string;
  /** YYYY-MM-DD, UTC day. */
  fromDay: string;
  /** YYYY-MM-DD, UTC day, included. */
  toDay: string;
}

/** Reads a UTC day typed as YYYY-MM-DD; epoch ms of its midnight, or null for anything else. */
export function parseUtcDay(text: string): number | null {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text.trim());
  if (!match) return null;
  const ms = Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3]));
  // Date.UTC rolls 2026-02-30 over to March; a day that does not round-trip was not a real day.
  return new Date(ms).toISOString().slice(0, 10) === text.trim() ? ms : null;
}

/** The instants the range covers: from midnight of fromDay up to (not including) midnight after toDay. */
export function rangeInstantsMs(range: SeriesRange): [number, number] {
  const fromMs = parseUtcDay(range.fromDay);
  const toMs = parseUtcDay(range.toDay);
  if (fromMs === null || toMs === null) throw new Error(`not a UTC day range: ${range.fromDay}..${range.toDay}`);
  return [fromMs, toMs + DAY_MS];
}

/** File name for a station series export, e.g. `isallo-KRO-2026-03-02-2026-03-09.csv`. */
export function seriesCsvFileName(stationCode: string, fromDay: string, toDay: string): string {
  const safeCode = stationCode.replace(/[^A-Za-z0-9_-]/g, '_');
  return `isallo-${safeCode}-${fromDay}-${toDay}.csv`;
}
