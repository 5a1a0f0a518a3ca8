import type { ApiErrorCode } from '@shared/api/errors';
import type { IntakeBatch, IntakeBatchDetail, IntakeBatchSortKey, IntakeFileResult, InventoryMatch } from '@shared/api/intake';
import type { Page, PageQuery } from '@shared/api/paging';
import type { ScanMetadataInput, ScanSummary } from '@shared/api/scans';
import { normalizeTags } from '@shared/api/parse-scan-metadata';
import type { StationSummary } from '@shared/api/stations';
import type { Db, DbOrTrx } from '../db/database';
import { PG_FOREIGN_KEY_VIOLATION, pgErrorCode } from '../db/pg-errors';
import { AppError, HTTP, validationFailed } from '../errors/app-error';
import type { ScanDeps } from '../scans/scan-deps';
import { uploadMaster, type ParsedUploadFields, type ReceivedFile } from '../scans/scan-upload.service';
import * as scansRepository from '../scans/scans.repository';
import * as scansService from '../scans/scans.service';
import * as stationsRepository from '../stations/stations.repository';
import * as intakeRepository from './intake.repository';
import { parseInventoryCsv, type InventoryRow } from './inventory-csv';
import { duplicateNote, matchInventory, type DuplicateFile } from './match-inventory';
import { readWrittenTime } from './written-time';

function batchNotFound(): AppError {
  return new AppError(HTTP.notFound, 'intake_batch_not_found', 'There is no intake batch with this id.');
}

export async function createBatch(db: Db, label: string, personId: string): Promise<IntakeBatch> {
  const id = await intakeRepository.insertBatch(db, label, personId);
  return getBatch(db, id);
}

export async function getBatch(db: DbOrTrx, batchId: string): Promise<IntakeBatch> {
  const batch = await intakeRepository.findBatchById(db, batchId);
  if (!batch) throw batchNotFound();
  return batch;
}

export async function listBatches(db: Db, query: PageQuery<IntakeBatchSortKey>): Promise<Page<IntakeBatch>> {
  const { items, total } = await intakeRepository.listBatches(db, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

export async function getBatchDetail(db: Db, batchId: string): Promise<IntakeBatchDetail> {
  const batch = await getBatch(db, batchId);
  const files = await intakeRepository.listFileRecords(db, batchId);
  const scans = await scansRepository.findScansInBatch(db, batchId);
  return { ...batch, files, scans };
}

/**
 * Stores one file of a batch and records its outcome: stored, or the refusal (a duplicate is 409
 * duplicate_scan, whose details name the scans holding the bytes), which is recorded and then thrown.
 * It is recorded here, where it is decided, so it stands whether the copy lost at the hash lookup or at
 * the unique index, and whether or not the client is still waiting for the answer.
 */
export async function receiveFile(deps: ScanDeps, batchId: string, file: ReceivedFile, fields: ParsedUploadFields, personId: string): Promise<IntakeFileResult> {
  await getBatch(deps.db, batchId);
  const scans = await uploadMaster(deps, file, { ...fields, batchId }, personId).catch(async (error: unknown) => {
    // A vanished batch has nothing to record against; a fault of ours (not an AppError) is no refusal.
    if (error instanceof AppError && error.code !== 'intake_batch_not_found') await recordRefusal(deps.db, batchId, file.originalName, error);
    throw error;
  });
  const scanIds = scans.map((scan) => scan.id);
  await intakeRepository.insertFileRecord(deps.db, { batchId, fileName: file.originalName, outcome: 'stored', reason: null, code: null, scanIds });
  return { fileName: file.originalName, outcome: 'stored', scans };
}

/** Every page's scan of the master a duplicate_scan refusal names (the error names the first page only). */
async function existingScanIdsOf(db: Db, error: AppError): Promise<string[]> {
  const existingScanId = (error.details as { existingScanId?: string } | undefined)?.existingScanId;
  if (!existingScanId) return [];
  const pages = await scansRepository.findScanIdsOfSameMaster(db, existingScanId);
  return pages.length > 0 ? pages : [existingScanId];
}

/** Records a refused file in the batch summary (a duplicate names the scans, every page, already holding its bytes). */
export async function recordRefusal(db: Db, batchId: string, fileName: string, error: AppError): Promise<void> {
  const isDuplicate = error.code === 'duplicate_scan';
  const scanIds = isDuplicate ? await existingScanIdsOf(db, error) : [];
  await intakeRepository
    .insertFileRecord(db, {
      batchId,
      fileName,
      outcome: isDuplicate ? 'duplicate' : 'rejected',
      reason: error.message,
      code: error.code as ApiErrorCode,
      scanIds,
    })
    .catch((recordError: unknown) => {
      // The batch was removed meanwhile: there is nothing to record against, and the refusal still stands.
      if (pgErrorCode(recordError) !== PG_FOREIGN_KEY_VIOLATION) throw recordError;
    });
}

function stationKey(value: string): string {
  return value.trim().toLowerCase();
}

/** Resolves each row's station (by code or name) and reads its written times; any bad cell is a 400 naming line and column. */
async function resolveRows(db: DbOrTrx, rows: InventoryRow[]): Promise<Map<number, { row: InventoryRow; station: StationSummary | null; chartOn: string | null; chartOff: string | null }>> {
  const stations = await stationsRepository.findStationsByCodeOrName(db, [...new Set(rows.map((row) => row.station).filter((station) => station !== ''))]);
  const byKey = new Map<string, StationSummary>();
  for (const station of stations) {
    byKey.set(stationKey(station.name), station);
    byKey.set(stationKey(station.code), station);
  }
  const details: Record<string, string> = {};
  const resolved = new Map<number, { row: InventoryRow; station: StationSummary | null; chartOn: string | null; chartOff: string | null }>();
  for (const row of rows) {
    const station = row.station === '' ? null : (byKey.get(stationKey(row.station)) ?? null);
    if (row.station !== '' && !station) details[`line ${row.line}, station`] = `no station has the code or name "${row.station}"`;
    // Without a station, a time without a zone is read as UTC.
    const clock = station ?? { timeZone: 'UTC', timeStandard: 'utc' as const };
    const chartOn = row.chartOn === '' ? null : readWrittenTime(row.chartOn, clock);
    const chartOff = row.chartOff === '' ? null : readWrittenTime(row.chartOff, clock);
    if (row.chartOn !== '' && !chartOn) details[`line ${row.line}, chart on`] = `"${row.chartOn}" is not a date and time such as 1931-03-02 08:00`;
    if (row.chartOff !== '' && !chartOff) details[`line ${row.line}, chart off`] = `"${row.chartOff}" is not a date and time such as 1931-03-09 08:00`;
    if (chartOn && chartOff && chartOff < chartOn) details[`line ${row.line}, chart off`] = 'chart off is before chart on';
    resolved.set(row.line, { row, station, chartOn, chartOff });
  }
  const problems = Object.keys(details);
  if (problems.length > 0) {
    throw validationFailed(details, `The inventory has ${problems.length} bad cell${problems.length === 1 ? '' : 's'}, first at ${problems[0]}: ${details[problems[0]]}.`);
  }
  return resolved;
}

/** The metadata a matched row gives a scan: only filled cells, never blanking what the archivist typed. */
function metadataFromRow(scan: { version: number }, resolved: { row: InventoryRow; station: StationSummary | null; chartOn: string | null; chartOff: string | null }): ScanMetadataInput {
  const { row } = resolved;
  const input: ScanMetadataInput = { version: scan.version };
  if (resolved.station) input.stationId = resolved.station.id;
  if (resolved.chartOn) input.chartOn = resolved.chartOn;
  if (resolved.chartOff) input.chartOff = resolved.chartOff;
  if (row.box) input.box = row.box;
  if (row.folder) input.folder = row.folder;
  if (row.notes) input.notes = row.notes;
  if (row.collection) input.collection = row.collection;
  if (row.item) input.item = row.item;
  if (row.observer) input.observer = row.observer;
  if (row.tags) input.tags = normalizeTags(row.tags.split(/[;,|]/));
  return input;
}

/** The batch's duplicate files with the scans holding their bytes (every page) and the note a row naming one gets. */
async function findDuplicateFiles(db: DbOrTrx, batchId: string): Promise<DuplicateFile[]> {
  const records = await intakeRepository.listDuplicateFiles(db, batchId);
  const existing = await intakeRepository.findScansSharingMaster(db, [...new Set(records.flatMap((record) => record.scanIds.slice(0, 1)))]);
  return records.map((record) => {
    const pages = record.scanIds.length > 0 ? (existing.get(record.scanIds[0]) ?? []) : [];
    return { fileName: record.fileName, existingScanIds: pages.map((page) => page.id), note: pages.length > 0 ? duplicateNote(record.fileName, pages[0], batchId) : '' };
  });
}

/**
 * Imports a box inventory for a batch: matches rows to the batch's files by name, fills the matched scans'
 * metadata (audited as 'inventory'), and lists rows without a file and files without a row. A row naming a
 * file refused as a duplicate is matched to the scans holding its bytes, with a note, and fills nothing:
 * those scans have a name and a record of their own (maybe another batch's, maybe already catalogued), so
 * the archivist decides. All or nothing: one transaction, and any bad row refuses the whole import.
 */
export async function importInventory(db: Db, batchId: string, csvText: string, personId: string): Promise<InventoryMatch> {
  const rows = parseInventoryCsv(csvText);
  return db.transaction().execute(async (trx) => {
    if (!(await intakeRepository.lockBatch(trx, batchId))) throw batchNotFound();
    const resolved = await resolveRows(trx, rows);
    const scans: ScanSummary[] = await scansRepository.findScansInBatch(trx, batchId);
    const match = matchInventory(rows, scans, await findDuplicateFiles(trx, batchId));
    for (const matched of match.matched) {
      if (matched.duplicateOf) continue;
      const source = resolved.get(matched.line)!;
      for (const scanId of matched.scanIds) {
        const current = await scansRepository.lockScan(trx, scanId);
        if (!current) continue;
        await scansService.applyScanMetadata(trx, scanId, metadataFromRow(current, source), personId, 'inventory');
      }
    }
    await intakeRepository.saveInventory(trx, batchId, rows);
    return match;
  });
}
