import type { PageQuery } from '@shared/api/paging';
import type { DerivativeState, ScanDetail, ScanSortKey, ScanStatus, ScanStatusCounts, ScanSummary } from '@shared/api/scans';
import { SCAN_STATUSES } from '@shared/api/scans';
import { sql, type Insertable, type Updateable } from 'kysely';
import type { DbOrTrx } from '../db/database';
import { PG_FOREIGN_KEY_VIOLATION, PG_UNIQUE_VIOLATION, pgConstraint, pgErrorCode } from '../db/pg-errors';
import { AppError, HTTP } from '../errors/app-error';
import { scanFilterWhere, type ScanFilter } from './scan-filters';
import { selectScans, toScanDetail, toScanSummary } from './scan-row';
import type { ScanTable } from './scan.table';

export type { ScanFilter } from './scan-filters';

const SORT_COLUMNS = {
  chartStart: 'scan.chart_start',
  uploadedAt: 'scan.uploaded_at',
  stationName: 'station.name',
  status: 'scan.status',
  originalName: 'scan.original_name',
} as const;

/**
 * The two queries of a catalogue page: the ids of the page's rows (filter, sort and limit on the scan table,
 * joining the station only to sort by its name) and the total under the filter. The full rows are read by id
 * afterwards, so names and ink-line counts are worked out for 25 rows, not for every match. The benchmark
 * explains these same queries.
 */
export function buildCatalogueQueries(db: DbOrTrx, filter: ScanFilter, query: PageQuery<ScanSortKey>) {
  const where = scanFilterWhere(filter);
  const sort = query.sort ?? 'chartStart';
  const base = sort === 'stationName' ? db.selectFrom('scan').leftJoin('station', 'station.id', 'scan.station_id') : db.selectFrom('scan');
  const ids = base
    .select('scan.id')
    .where(where)
    // Scans still without a chart start (or station) sort last either way, after the known ones.
    // station.name is joined only for its own sort, so the column is named by reference here.
    .orderBy(sql.ref(SORT_COLUMNS[sort]), (ob) => (query.direction === 'asc' ? ob.asc().nullsLast() : ob.desc().nullsLast()))
    .orderBy('scan.id')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize);
  const count = db
    .selectFrom('scan')
    .select((eb) => eb.fn.countAll<number>().as('total'))
    .where(where);
  return { ids, count };
}

/**
 * The filter with the catalogue's longest chart span filled in when it has a `from` (an index read of
 * scan_span_length_idx), so the date range can be bounded on both sides.
 */
export async function withLongestSpan(db: DbOrTrx, filter: ScanFilter): Promise<ScanFilter> {
  if (!filter.from) return filter;
  const row = await db
    .selectFrom('scan')
    .select(sql<number | null>`extract(epoch from max(span_end - span_start)) * 1000`.as('longest_ms'))
    .executeTakeFirst();
  return { ...filter, longestSpanMs: Math.max(0, Number(row?.longest_ms ?? 0)) };
}

export async function listScans(
  db: DbOrTrx,
  filter: ScanFilter,
  query: PageQuery<ScanSortKey>,
): Promise<{ items: ScanSummary[]; total: number }> {
  const { ids, count } = buildCatalogueQueries(db, await withLongestSpan(db, filter), query);
  const [pageIds, { total }] = await Promise.all([ids.execute(), count.executeTakeFirstOrThrow()]);
  if (pageIds.length === 0) return { items: [], total };
  const rows = await selectScans(db).where('scan.id', 'in', pageIds.map((row) => row.id)).execute();
  const byId = new Map(rows.map((row) => [row.id, row]));
  return { items: pageIds.map((row) => toScanSummary(byId.get(row.id)!)), total };
}

/** The query behind countScansByStatus, for the benchmark. */
export function buildStatusCountQuery(db: DbOrTrx, filter: ScanFilter) {
  return db
    .selectFrom('scan')
    .select((eb) => ['scan.status', eb.fn.countAll<number>().as('count')])
    .where(scanFilterWhere(filter, { withStatus: false }))
    .groupBy('scan.status');
}

/** Scans per status under the filter (its own status filter left out). */
export async function countScansByStatus(db: DbOrTrx, filter: ScanFilter): Promise<ScanStatusCounts> {
  const rows = await buildStatusCountQuery(db, await withLongestSpan(db, filter)).execute();
  const counts = Object.fromEntries(SCAN_STATUSES.map((status) => [status, 0])) as ScanStatusCounts;
  for (const row of rows) counts[row.status] = Number(row.count);
  return counts;
}

export async function findScanById(db: DbOrTrx, scanId: string): Promise<ScanDetail | undefined> {
  const row = await selectScans(db).where('scan.id', '=', scanId).executeTakeFirst();
  return row ? toScanDetail(row) : undefined;
}

export async function findScansByIds(db: DbOrTrx, scanIds: string[]): Promise<ScanSummary[]> {
  if (scanIds.length === 0) return [];
  const rows = await selectScans(db).where('scan.id', 'in', scanIds).orderBy('scan.original_name').orderBy('scan.page_index').execute();
  return rows.map(toScanSummary);
}

export async function findScansInBatch(db: DbOrTrx, batchId: string): Promise<ScanSummary[]> {
  const rows = await selectScans(db).where('scan.batch_id', '=', batchId).orderBy('scan.original_name').orderBy('scan.page_index').execute();
  return rows.map(toScanSummary);
}

/** Every scan catalogued in one box of a collection, in shelf order (folder, item, chart start, file, page), in one query. */
export async function findScansInBox(db: DbOrTrx, collection: string, box: string): Promise<ScanDetail[]> {
  const rows = await selectScans(db)
    .where('scan.collection', '=', collection)
    .where('scan.box', '=', box)
    .orderBy('scan.folder')
    .orderBy('scan.item')
    .orderBy('scan.chart_start')
    .orderBy('scan.original_name')
    .orderBy('scan.page_index')
    .execute();
  return rows.map(toScanDetail);
}

/** The first page's scan of a master, by the master's hash. */
export async function findScanIdBySha256(db: DbOrTrx, sha256: string): Promise<string | undefined> {
  const row = await db.selectFrom('scan').select('id').where('sha256', '=', sha256).orderBy('page_index').executeTakeFirst();
  return row?.id;
}

/** Every page's scan of the master that the given scan is a page of, first page first (empty when there is no such scan). */
export async function findScanIdsOfSameMaster(db: DbOrTrx, scanId: string): Promise<string[]> {
  const rows = await db
    .selectFrom('scan as named')
    .innerJoin('scan', 'scan.sha256', 'named.sha256')
    .select('scan.id')
    .where('named.id', '=', scanId)
    .orderBy('scan.page_index')
    .execute();
  return rows.map((row) => row.id);
}

/** Where a scan's master is stored and which page of it the scan is. */
export interface ScanFile {
  storageKey: string;
  sha256: string;
  mediaType: string;
  pageIndex: number;
  widthPx: number;
  heightPx: number;
}

export async function findScanFile(db: DbOrTrx, scanId: string): Promise<ScanFile | undefined> {
  const row = await db
    .selectFrom('scan')
    .select(['storage_key', 'sha256', 'media_type', 'page_index', 'width_px', 'height_px'])
    .where('id', '=', scanId)
    .executeTakeFirst();
  return row
    ? { storageKey: row.storage_key, sha256: row.sha256, mediaType: row.media_type, pageIndex: row.page_index, widthPx: row.width_px, heightPx: row.height_px }
    : undefined;
}

/**
 * Inserts one row per page of a master. A second upload of the same bytes that raced past the service's
 * own check hits the unique (sha256, page_index); that comes back as `{ duplicateOf }` instead of an exception.
 */
export async function insertScans(
  db: DbOrTrx,
  pages: Insertable<ScanTable>[],
): Promise<{ scanIds: string[] } | { duplicateOf: string | undefined }> {
  try {
    const rows = await db.insertInto('scan').values(pages).returning(['id', 'page_index']).execute();
    return { scanIds: rows.sort((a, b) => a.page_index - b.page_index).map((row) => row.id) };
  } catch (error) {
    if (pgErrorCode(error) === PG_FOREIGN_KEY_VIOLATION) throw missingReference(pgConstraint(error));
    if (pgErrorCode(error) !== PG_UNIQUE_VIOLATION) throw error;
    return { duplicateOf: undefined };
  }
}

/** A row the scan points at was removed between the service's checks and the write. */
export function missingReference(constraint: string | undefined): AppError {
  if (constraint === 'scan_station_id_fkey') return new AppError(HTTP.notFound, 'station_not_found', 'There is no station with this id.');
  if (constraint === 'scan_chart_form_id_fkey') return new AppError(HTTP.notFound, 'chart_form_not_found', 'There is no chart form with this id.');
  if (constraint === 'scan_instrument_id_fkey') return new AppError(HTTP.notFound, 'instrument_not_found', 'There is no instrument with this id.');
  if (constraint === 'scan_batch_id_fkey') return new AppError(HTTP.notFound, 'intake_batch_not_found', 'There is no intake batch with this id.');
  return new AppError(HTTP.unauthorized, 'unauthenticated', 'Your account no longer exists.');
}

/** The scan's row locked for a change in this transaction. */
export async function lockScan(db: DbOrTrx, scanId: string): Promise<ScanDetail | undefined> {
  const locked = await db.selectFrom('scan').select('id').where('id', '=', scanId).forUpdate().executeTakeFirst();
  return locked ? findScanById(db, scanId) : undefined;
}

/** Writes columns and bumps the version, only while the row is at `version`; false when it is not. */
export async function updateScanColumns(db: DbOrTrx, scanId: string, version: number, columns: Updateable<ScanTable>): Promise<boolean> {
  try {
    const result = await db
      .updateTable('scan')
      .set({ ...columns, version: version + 1 })
      .where('id', '=', scanId)
      .where('version', '=', version)
      .executeTakeFirst();
    return Number(result.numUpdatedRows) === 1;
  } catch (error) {
    if (pgErrorCode(error) === PG_FOREIGN_KEY_VIOLATION) throw missingReference(pgConstraint(error));
    throw error;
  }
}

export async function updateScanStatus(db: DbOrTrx, scanId: string, status: ScanStatus): Promise<void> {
  await db
    .updateTable('scan')
    .set((eb) => ({ status, version: eb('version', '+', 1) }))
    .where('id', '=', scanId)
    .execute();
}

/** Records the worker's progress on a scan's derivatives (no version bump: it is not catalogue metadata). */
export async function setDerivativeState(
  db: DbOrTrx,
  scanId: string,
  state: DerivativeState,
  details: { error?: string | null; isAttempt?: boolean } = {},
): Promise<void> {
  await db
    .updateTable('scan')
    .set((eb) => ({
      derivative_state: state,
      derivative_error: details.error ?? null,
      ...(details.isAttempt ? { derivative_attempts: eb('derivative_attempts', '+', 1) } : {}),
    }))
    .where('id', '=', scanId)
    .execute();
}

/** Scans whose derivatives a worker should (re)make: never finished, or stuck mid-job by a crash. */
export async function findScanIdsNeedingDerivatives(db: DbOrTrx): Promise<string[]> {
  const rows = await db.selectFrom('scan').select('id').where('derivative_state', 'in', ['queued', 'working']).execute();
  return rows.map((row) => row.id);
}

/** What tracing needs of a scan: its state, catalogue fields and chart span. */
export interface ScanForTracing {
  id: string;
  status: ScanStatus;
  stationId: string | null;
  chartFormId: string | null;
  chartStart: Date | null;
  chartOn: Date | null;
  chartOff: Date | null;
  widthPx: number;
  heightPx: number;
}

/** The scan as tracing needs it; `forUpdate` locks it against a concurrent status change in a transaction. */
export async function findScanForTracing(db: DbOrTrx, scanId: string, { forUpdate }: { forUpdate: boolean }): Promise<ScanForTracing | undefined> {
  const query = db
    .selectFrom('scan')
    .select(['id', 'station_id', 'chart_form_id', 'chart_start', 'chart_on', 'chart_off', 'status', 'width_px', 'height_px'])
    .where('id', '=', scanId);
  const row = await (forUpdate ? query.forUpdate() : query).executeTakeFirst();
  return row
    ? {
        id: row.id,
        status: row.status,
        stationId: row.station_id,
        chartFormId: row.chart_form_id,
        chartStart: row.chart_start,
        chartOn: row.chart_on,
        chartOff: row.chart_off,
        widthPx: row.width_px,
        heightPx: row.height_px,
      }
    : undefined;
}
