import type { ExpressionBuilder } from 'kysely';
import type { Database, DbOrTrx } from '../db/database';

/**
 * Which ink lines make up a station series: approved lines of scans that are not withdrawn, and nothing else.
 * A handed-in line waits for the archivist; a draft or returned line is its volunteer's work in progress.
 * This is the one place that says so: the series reads, the CSV export, the lessons (through the series
 * service) and whatever rebuilds a stored series from series_change all use it.
 */
export const SERIES_INK_LINE_STATUS = 'approved';

/** True for an ink line (joined with its scan) that belongs to its station's series. */
export function inkLineCountsInSeries(eb: ExpressionBuilder<Database, 'ink_line' | 'scan'>) {
  return eb.and([eb('ink_line.status', '=', SERIES_INK_LINE_STATUS), eb('scan.status', '!=', 'withdrawn')]);
}

/** The same rule in plain values, for a decision that must know whether a line enters or leaves the series. */
export function countsInSeries(inkLineStatus: string, scanStatus: string): boolean {
  return inkLineStatus === SERIES_INK_LINE_STATUS && scanStatus !== 'withdrawn';
}

/** Ids of the ink lines of a station that belong to its series now (for a rebuild). */
export async function findSeriesInkLineIds(db: DbOrTrx, stationId: string): Promise<string[]> {
  const rows = await db
    .selectFrom('ink_line')
    .innerJoin('scan', 'scan.id', 'ink_line.scan_id')
    .select('ink_line.id')
    .where('scan.station_id', '=', stationId)
    .where(inkLineCountsInSeries)
    .orderBy('ink_line.id')
    .execute();
  return rows.map((row) => row.id);
}

/** True when the scan has a line in its station's series: a climatologist may then see the scan's images. */
export async function scanHasSeriesLine(db: DbOrTrx, scanId: string): Promise<boolean> {
  const row = await db
    .selectFrom('ink_line')
    .innerJoin('scan', 'scan.id', 'ink_line.scan_id')
    .select('ink_line.id')
    .where('scan.id', '=', scanId)
    .where(inkLineCountsInSeries)
    .limit(1)
    .executeTakeFirst();
  return row !== undefined;
}
