import type { ApiErrorCode } from '@shared/api/errors';
import type { IntakeBatch, IntakeBatchSortKey, IntakeFileRecord, IntakeOutcome } from '@shared/api/intake';
import type { PageQuery } from '@shared/api/paging';
import { sql } from 'kysely';
import type { DbOrTrx } from '../db/database';
import type { InventoryRow } from './inventory-csv';
import type { ExistingScan } from './match-inventory';

const SORT_COLUMNS = { createdAt: 'intake_batch.created_at', label: 'intake_batch.label' } as const;

function selectBatches(db: DbOrTrx) {
  return db
    .selectFrom('intake_batch')
    .innerJoin('person', 'person.id', 'intake_batch.created_by')
    .select((eb) => [
      'intake_batch.id',
      'intake_batch.label',
      'intake_batch.created_at',
      'person.display_name as created_by_name',
      sql<boolean>`intake_batch.inventory is not null`.as('has_inventory'),
      eb.selectFrom('intake_file').select((inner) => inner.fn.countAll<number>().as('n')).whereRef('intake_file.batch_id', '=', 'intake_batch.id').as('file_count'),
      eb
        .selectFrom('intake_file')
        .select((inner) => inner.fn.countAll<number>().as('n'))
        .whereRef('intake_file.batch_id', '=', 'intake_batch.id')
        .where('intake_file.outcome', '=', 'stored')
        .as('stored_count'),
      eb
        .selectFrom('intake_file')
        .select((inner) => inner.fn.countAll<number>().as('n'))
        .whereRef('intake_file.batch_id', '=', 'intake_batch.id')
        .where('intake_file.outcome', '=', 'duplicate')
        .as('duplicate_count'),
      eb
        .selectFrom('intake_file')
        .select((inner) => inner.fn.countAll<number>().as('n'))
        .whereRef('intake_file.batch_id', '=', 'intake_batch.id')
        .where('intake_file.outcome', '=', 'rejected')
        .as('rejected_count'),
    ]);
}

type BatchRow = Awaited<ReturnType<ReturnType<typeof selectBatches>['executeTakeFirstOrThrow']>>;

function toIntakeBatch(row: BatchRow): IntakeBatch {
  return {
    id: row.id,
    label: row.label,
    createdAt: row.created_at.toISOString(),
    createdByName: row.created_by_name,
    fileCount: Number(row.file_count ?? 0),
    counts: { stored: Number(row.stored_count ?? 0), duplicate: Number(row.duplicate_count ?? 0), rejected: Number(row.rejected_count ?? 0) },
    hasInventory: row.has_inventory,
  };
}

export async function insertBatch(db: DbOrTrx, label: string, createdBy: string): Promise<string> {
  const { id } = await db.insertInto('intake_batch').values({ label, created_by: createdBy }).returning('id').executeTakeFirstOrThrow();
  return id;
}

export async function findBatchById(db: DbOrTrx, batchId: string): Promise<IntakeBatch | undefined> {
  const row = await selectBatches(db).where('intake_batch.id', '=', batchId).executeTakeFirst();
  return row ? toIntakeBatch(row) : undefined;
}

export async function listBatches(db: DbOrTrx, query: PageQuery<IntakeBatchSortKey>): Promise<{ items: IntakeBatch[]; total: number }> {
  const rows = await selectBatches(db)
    .orderBy(SORT_COLUMNS[query.sort ?? 'createdAt'], query.sort ? query.direction : 'desc')
    .orderBy('intake_batch.id')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await db.selectFrom('intake_batch').select((eb) => eb.fn.countAll<number>().as('total')).executeTakeFirstOrThrow();
  return { items: rows.map(toIntakeBatch), total };
}

export async function insertFileRecord(
  db: DbOrTrx,
  record: { batchId: string; fileName: string; outcome: IntakeOutcome; reason: string | null; code: ApiErrorCode | null; scanIds: string[] },
): Promise<void> {
  await db
    .insertInto('intake_file')
    .values({ batch_id: record.batchId, file_name: record.fileName, outcome: record.outcome, reason: record.reason, code: record.code, scan_ids: record.scanIds })
    .execute();
}

export async function listFileRecords(db: DbOrTrx, batchId: string): Promise<IntakeFileRecord[]> {
  const rows = await db.selectFrom('intake_file').selectAll().where('batch_id', '=', batchId).orderBy('at').orderBy('id').execute();
  return rows.map((row) => ({ fileName: row.file_name, outcome: row.outcome, reason: row.reason, code: row.code, scanIds: row.scan_ids, at: row.at.toISOString() }));
}

export async function saveInventory(db: DbOrTrx, batchId: string, rows: InventoryRow[]): Promise<void> {
  await db.updateTable('intake_batch').set({ inventory: JSON.stringify(rows) }).where('id', '=', batchId).execute();
}

/** Locks the batch row, so two inventory imports of one batch run one after the other. */
export async function lockBatch(db: DbOrTrx, batchId: string): Promise<boolean> {
  return (await db.selectFrom('intake_batch').select('id').where('id', '=', batchId).forUpdate().executeTakeFirst()) !== undefined;
}

/** The batch's files refused as duplicates, with the scan ids their records name, oldest first. */
export async function listDuplicateFiles(db: DbOrTrx, batchId: string): Promise<{ fileName: string; scanIds: string[] }[]> {
  const rows = await db
    .selectFrom('intake_file')
    .select(['file_name', 'scan_ids'])
    .where('batch_id', '=', batchId)
    .where('outcome', '=', 'duplicate')
    .orderBy('at')
    .orderBy('id')
    .execute();
  return rows.map((row) => ({ fileName: row.file_name, scanIds: row.scan_ids }));
}

/**
 * For each given scan, every page's scan of the same master with the batch it came in by (first page first):
 * a duplicate's record may name only the first page.
 */
export async function findScansSharingMaster(db: DbOrTrx, scanIds: string[]): Promise<Map<string, ExistingScan[]>> {
  const found = new Map<string, ExistingScan[]>();
  if (scanIds.length === 0) return found;
  const rows = await db
    .selectFrom('scan as named')
    .innerJoin('scan', 'scan.sha256', 'named.sha256')
    .leftJoin('intake_batch', 'intake_batch.id', 'scan.batch_id')
    .select(['named.id as named_id', 'scan.id', 'scan.original_name', 'scan.batch_id', 'intake_batch.label'])
    .where('named.id', 'in', scanIds)
    .orderBy('named.id')
    .orderBy('scan.page_index')
    .execute();
  for (const row of rows) {
    const pages = found.get(row.named_id) ?? [];
    pages.push({ id: row.id, originalName: row.original_name, batchId: row.batch_id, batchLabel: row.label });
    found.set(row.named_id, pages);
  }
  return found;
}
