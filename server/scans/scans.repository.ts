import type { PageQuery } from '@shared/api/paging';
import type { ScanDetail, ScanSortKey, ScanStatus, ScanSummary } from '@shared/api/scans';
import type { Insertable } from 'kysely';
import type { DbOrTrx } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import { PG_FOREIGN_KEY_VIOLATION, PG_UNIQUE_VIOLATION, pgConstraint, pgErrorCode } from '../db/pg-errors';
import type { ScanTable } from './scan.table';

const SORT_COLUMNS = {
  periodStart: 'scan.period_start',
  uploadedAt: 'scan.uploaded_at',
  stationName: 'station.name',
  status: 'scan.status',
  originalName: 'scan.original_name',
} as const;

export interface ScanFilter {
  status?: ScanStatus;
  stationId?: string;
}

function selectScanSummaries(db: DbOrTrx) {
  return db
    .selectFrom('scan')
    .innerJoin('station', 'station.id', 'scan.station_id')
    .innerJoin('chart_form', 'chart_form.id', 'scan.chart_form_id')
    .select((eb) => [
      'scan.id',
      'scan.station_id',
      'station.name as station_name',
      'scan.chart_form_id',
      'chart_form.name as chart_form_name',
      'scan.period_start',
      'scan.status',
      'scan.original_name',
      'scan.media_type',
      'scan.size_bytes',
      'scan.width_px',
      'scan.height_px',
      'scan.sha256',
      'scan.uploaded_at',
      eb
        .selectFrom('ink_line')
        .select((inner) => inner.fn.countAll<number>().as('count'))
        .whereRef('ink_line.scan_id', '=', 'scan.id')
        .as('ink_line_count'),
    ]);
}

type ScanSummaryRow = Awaited<ReturnType<ReturnType<typeof selectScanSummaries>['executeTakeFirstOrThrow']>>;

function toScanSummary(row: ScanSummaryRow): ScanSummary {
  return {
    id: row.id,
    stationId: row.station_id,
    stationName: row.station_name,
    chartFormId: row.chart_form_id,
    chartFormName: row.chart_form_name,
    periodStart: row.period_start.toISOString(),
    status: row.status,
    originalName: row.original_name,
    mediaType: row.media_type,
    sizeBytes: row.size_bytes,
    widthPx: row.width_px,
    heightPx: row.height_px,
    sha256: row.sha256,
    uploadedAt: row.uploaded_at.toISOString(),
    inkLineCount: Number(row.ink_line_count ?? 0),
  };
}

export async function listScans(
  db: DbOrTrx,
  filter: ScanFilter,
  query: PageQuery<ScanSortKey>,
): Promise<{ items: ScanSummary[]; total: number }> {
  let rows = selectScanSummaries(db);
  let count = db.selectFrom('scan').select((eb) => eb.fn.countAll<number>().as('total'));
  if (filter.status) {
    rows = rows.where('scan.status', '=', filter.status);
    count = count.where('scan.status', '=', filter.status);
  }
  if (filter.stationId) {
    rows = rows.where('scan.station_id', '=', filter.stationId);
    count = count.where('scan.station_id', '=', filter.stationId);
  }
  const items = await rows
    .orderBy(SORT_COLUMNS[query.sort ?? 'periodStart'], query.direction)
    .orderBy('scan.id')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await count.executeTakeFirstOrThrow();
  return { items: items.map(toScanSummary), total };
}

export async function findScanById(db: DbOrTrx, scanId: string): Promise<ScanDetail | undefined> {
  const row = await selectScanSummaries(db).where('scan.id', '=', scanId).executeTakeFirst();
  return row ? toScanSummary(row) : undefined;
}

export async function findScanIdBySha256(db: DbOrTrx, sha256: string): Promise<string | undefined> {
  const row = await db.selectFrom('scan').select('id').where('sha256', '=', sha256).executeTakeFirst();
  return row?.id;
}

/** Where a scan's master is stored, with its hash (for the preview cache). */
export async function findScanFile(db: DbOrTrx, scanId: string): Promise<{ storageKey: string; sha256: string } | undefined> {
  const row = await db.selectFrom('scan').select(['storage_key', 'sha256']).where('id', '=', scanId).executeTakeFirst();
  return row ? { storageKey: row.storage_key, sha256: row.sha256 } : undefined;
}

/**
 * Inserts a scan row. A second upload of the same bytes that raced past the service's own check
 * hits the unique index on sha256; that comes back as `{ duplicateOf }` instead of an exception.
 */
export async function insertScan(
  db: DbOrTrx,
  scan: Insertable<ScanTable>,
): Promise<{ scanId: string } | { duplicateOf: string | undefined }> {
  try {
    const { id } = await db.insertInto('scan').values(scan).returning('id').executeTakeFirstOrThrow();
    return { scanId: id };
  } catch (error) {
    if (pgErrorCode(error) === PG_FOREIGN_KEY_VIOLATION) throw missingReference(pgConstraint(error));
    if (pgErrorCode(error) !== PG_UNIQUE_VIOLATION) throw error;
    return { duplicateOf: await findScanIdBySha256(db, scan.sha256) };
  }
}

/** A row the scan points at was removed between the service's checks and the insert. */
function missingReference(constraint: string | undefined): AppError {
  if (constraint === 'scan_station_id_fkey') return new AppError(HTTP.notFound, 'station_not_found', 'There is no station with this id.');
  if (constraint === 'scan_chart_form_id_fkey') {
    return new AppError(HTTP.notFound, 'chart_form_not_found', 'There is no chart form with this id.');
  }
  return new AppError(HTTP.unauthorized, 'unauthenticated', 'Your account no longer exists.');
}

export async function updateScanStatus(db: DbOrTrx, scanId: string, status: ScanStatus): Promise<void> {
  await db.updateTable('scan').set({ status }).where('id', '=', scanId).execute();
}

/** What the hand-in needs of a scan, locked against a concurrent status change when run in a transaction. */
export async function findScanForTracing(
  db: DbOrTrx,
  scanId: string,
): Promise<{ id: string; stationId: string; chartFormId: string; periodStart: Date; status: ScanStatus } | undefined> {
  const row = await db
    .selectFrom('scan')
    .select(['id', 'station_id', 'chart_form_id', 'period_start', 'status'])
    .where('id', '=', scanId)
    .forUpdate()
    .executeTakeFirst();
  return row
    ? { id: row.id, stationId: row.station_id, chartFormId: row.chart_form_id, periodStart: row.period_start, status: row.status }
    : undefined;
}
