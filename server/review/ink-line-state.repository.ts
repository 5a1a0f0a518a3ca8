import type { InkLineStatus } from '@shared/api/ink-lines';
import type { ScanStatus } from '@shared/api/scans';
import type { DbOrTrx } from '../db/database';
import type { ReviewDecision } from './review.table';

/** An ink line with what a decision on it needs of its scan. */
export interface InkLineForDecision {
  id: string;
  scanId: string;
  authorId: string;
  status: InkLineStatus;
  version: number;
  stationId: string | null;
  scanStatus: ScanStatus;
}

export async function findInkLineScanId(db: DbOrTrx, inkLineId: string): Promise<string | undefined> {
  const row = await db.selectFrom('ink_line').select('scan_id').where('id', '=', inkLineId).executeTakeFirst();
  return row?.scan_id;
}

/**
 * The ink line locked for a decision in this transaction. The caller locks the scan first (as the hand-in
 * does), so a decision and a hand-in on one chart always take their locks in the same order.
 */
export async function lockInkLine(db: DbOrTrx, inkLineId: string): Promise<InkLineForDecision | undefined> {
  const row = await db
    .selectFrom('ink_line')
    .innerJoin('scan', 'scan.id', 'ink_line.scan_id')
    .select(['ink_line.id', 'ink_line.scan_id', 'ink_line.author_id', 'ink_line.status', 'ink_line.version', 'scan.station_id', 'scan.status as scan_status'])
    .where('ink_line.id', '=', inkLineId)
    .forUpdate('ink_line')
    .executeTakeFirst();
  return row
    ? { id: row.id, scanId: row.scan_id, authorId: row.author_id, status: row.status, version: row.version, stationId: row.station_id, scanStatus: row.scan_status }
    : undefined;
}

/** Moves the line to `status` while it is at `version`; the new version, or null when someone moved it first. */
export async function moveInkLine(db: DbOrTrx, inkLineId: string, version: number, status: InkLineStatus): Promise<number | null> {
  const row = await db
    .updateTable('ink_line')
    .set({ status, version: version + 1, updated_at: new Date() })
    .where('id', '=', inkLineId)
    .where('version', '=', version)
    .returning('version')
    .executeTakeFirst();
  return row?.version ?? null;
}

export async function insertReview(db: DbOrTrx, review: { inkLineId: string; decision: ReviewDecision; note: string; personId: string }): Promise<void> {
  await db
    .insertInto('ink_line_review')
    .values({ ink_line_id: review.inkLineId, decision: review.decision, note: review.note, person_id: review.personId })
    .execute();
}

/** Every ink line of a scan: id, author and status. */
export async function findScanInkLines(db: DbOrTrx, scanId: string): Promise<{ id: string; authorId: string; status: InkLineStatus }[]> {
  const rows = await db.selectFrom('ink_line').select(['id', 'author_id', 'status']).where('scan_id', '=', scanId).orderBy('id').execute();
  return rows.map((row) => ({ id: row.id, authorId: row.author_id, status: row.status }));
}

/** How many independent ink lines the station's charts need: its tracing setting, or 1. */
export async function findInkLinesRequired(db: DbOrTrx, stationId: string | null): Promise<1 | 2> {
  if (!stationId) return 1;
  const row = await db.selectFrom('station_tracing').select('ink_lines_required').where('station_id', '=', stationId).executeTakeFirst();
  return row?.ink_lines_required === 2 ? 2 : 1;
}
