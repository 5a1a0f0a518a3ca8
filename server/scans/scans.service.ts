import fs from 'node:fs/promises';
import type { Page, PageQuery } from '@shared/api/paging';
import type { ScanChangeLogEntry, ScanDetail, ScanMetadataInput, ScanSortKey, ScanStatusChange, ScanStatusCounts, ScanSummary } from '@shared/api/scans';
import { SCAN_STATUS_LABELS } from '@shared/api/scans';
import * as auditRepository from '../audit/scan-audit.repository';
import type { Db, DbOrTrx } from '../db/database';
import { AppError, HTTP, validationFailed } from '../errors/app-error';
import { versionConflict } from '../http/version-conflict';
import * as instrumentsRepository from '../instruments/instruments.repository';
import type { Storage } from '../storage/storage';
import { diffScanMetadata, TRACING_FIELDS } from './scan-metadata';
import { missingForTracing } from '@shared/api/scan-status';
import { findInkLinesRequired, findScanInkLines } from '../review/ink-line-state.repository';
import { statusFromInkLines } from '../review/scan-status-from-lines';
import { recordSeriesChanges } from '../series/series-change';
import { SERIES_INK_LINE_STATUS } from '../series/series-membership';
import { checkStatusMove } from './scan-status';
import type { ScanDeps } from './scan-deps';
import { PREVIEW_LONGEST_SIDE_PX, writePreview } from './scan-image';
import { findPageSource } from '../jobs/page-source';
import * as scansRepository from './scans.repository';
import type { ScanFilter } from './scans.repository';
import { uploadMaster, type ParsedUploadFields, type ReceivedFile } from './scan-upload.service';

export type { ParsedUploadFields, ReceivedFile } from './scan-upload.service';

function scanNotFound(): AppError {
  return new AppError(HTTP.notFound, 'scan_not_found', 'There is no scan with this id.');
}

/** The issue-2 upload: one file with station, chart form and chart start; answers its first page's scan. */
export async function uploadScan(deps: ScanDeps, file: ReceivedFile, fields: ParsedUploadFields, uploadedBy: string): Promise<ScanDetail> {
  const [first] = await uploadMaster(deps, file, fields, uploadedBy);
  return first;
}

export async function listScans(db: Db, filter: ScanFilter, query: PageQuery<ScanSortKey>): Promise<Page<ScanSummary>> {
  const { items, total } = await scansRepository.listScans(db, filter, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

export async function countScansByStatus(db: Db, filter: ScanFilter): Promise<ScanStatusCounts> {
  return scansRepository.countScansByStatus(db, filter);
}

/** The scan, or 404 scan_not_found (also for a withdrawn scan when `hideWithdrawn`, so a volunteer learns nothing of it). */
export async function getScan(db: DbOrTrx, scanId: string, options: { hideWithdrawn?: boolean } = {}): Promise<ScanDetail> {
  const scan = await scansRepository.findScanById(db, scanId);
  if (!scan || (options.hideWithdrawn && scan.status === 'withdrawn')) throw scanNotFound();
  return scan;
}

/** The instrument must have served the scan's station (when both are set). */
async function checkInstrumentStation(db: DbOrTrx, instrumentId: string | null, stationId: string | null): Promise<void> {
  if (!instrumentId) return;
  const instrument = await instrumentsRepository.findInstrumentById(db, instrumentId);
  if (!instrument) throw new AppError(HTTP.notFound, 'instrument_not_found', 'There is no instrument with this id.');
  if (stationId && instrument.stationId !== stationId) {
    throw validationFailed({ instrumentId: 'this instrument belongs to another station' }, 'The scan has invalid fields.');
  }
}

/**
 * Edits a scan's catalogue metadata at the version the archivist read, writing the audit row in the same
 * transaction. Tracing fields stay fixed on a traced or approved scan, and a ready-to-trace scan keeps
 * everything tracing needs.
 */
export async function updateScanMetadata(db: Db, scanId: string, input: ScanMetadataInput, personId: string): Promise<ScanDetail> {
  return db.transaction().execute((trx) => applyScanMetadata(trx, scanId, input, personId, 'edit'));
}

/** updateScanMetadata's work inside a caller's transaction (the inventory import applies many rows in one). */
export async function applyScanMetadata(
  trx: DbOrTrx,
  scanId: string,
  input: ScanMetadataInput,
  personId: string,
  action: 'edit' | 'inventory',
): Promise<ScanDetail> {
  {
    const current = await scansRepository.lockScan(trx, scanId);
    if (!current) throw scanNotFound();
    if (current.version !== input.version) throw versionConflict('scan', current.version);
    const { version, ...patch } = input;
    const { columns, changes } = diffScanMetadata(current, patch);
    if (Object.keys(changes).length === 0) return current;

    if ((current.status === 'traced' || current.status === 'approved') && TRACING_FIELDS.some((field) => field in changes)) {
      throw new AppError(
        HTTP.conflict,
        'scan_fields_locked',
        `The station, chart form and chart start of a ${SCAN_STATUS_LABELS[current.status]} scan are what its ink line was read with; return it to ready to trace first.`,
      );
    }
    const merged = { ...current, ...patch } as ScanDetail;
    if (current.status === 'ready_to_trace') {
      const missing = missingForTracing(merged).filter((field) => field !== 'derivativeState');
      if (missing.length > 0) {
        throw new AppError(HTTP.conflict, 'scan_incomplete', 'A scan that is ready to trace needs its station, chart form and chart start.', { missing });
      }
    }
    if ('instrumentId' in changes || 'stationId' in changes) await checkInstrumentStation(trx, merged.instrumentId, merged.stationId);
    if (merged.chartOn && merged.chartOff && merged.chartOff < merged.chartOn) {
      throw validationFailed({ chartOff: 'chartOff must not be before chartOn' }, 'The scan has invalid fields.');
    }

    if (!(await scansRepository.updateScanColumns(trx, scanId, version, columns))) throw versionConflict('scan', current.version);
    await auditRepository.insertScanAudit(trx, { scanId, personId, action, changes });
    return getScan(trx, scanId);
  }
}

/**
 * Moves a scan through the catalogue states, audited in the same transaction. Withdrawing takes the scan's
 * approved ink lines out of its station's series and restoring puts them back (recorded in series_change); a
 * restored scan comes back to the status its ink lines give (received when it has none handed in).
 */
export async function changeScanStatus(db: Db, scanId: string, change: ScanStatusChange, personId: string): Promise<ScanDetail> {
  return db.transaction().execute(async (trx) => {
    const current = await scansRepository.lockScan(trx, scanId);
    if (!current) throw scanNotFound();
    checkStatusMove(current, change.status);
    const lines = await findScanInkLines(trx, scanId);
    const target =
      current.status === 'withdrawn'
        ? statusFromInkLines(lines.map((line) => line.status), await findInkLinesRequired(trx, current.stationId), change.status)
        : change.status;
    const withdrawnReason = target === 'withdrawn' ? (change.reason ?? null) : null;
    await scansRepository.updateScanColumns(trx, scanId, current.version, { status: target, withdrawn_reason: withdrawnReason });
    const wasInSeries = current.status !== 'withdrawn';
    const isInSeries = target !== 'withdrawn';
    if (current.stationId && wasInSeries !== isInSeries) {
      await recordSeriesChanges(
        trx,
        lines
          .filter((line) => line.status === SERIES_INK_LINE_STATUS)
          .map((line) => ({
            stationId: current.stationId as string,
            inkLineId: line.id,
            change: isInSeries ? ('added' as const) : ('removed' as const),
            personId,
            reason: isInSeries ? 'scan restored' : `scan withdrawn: ${withdrawnReason ?? ''}`,
          })),
      );
    }
    const changes: Record<string, { before: unknown; after: unknown }> = { status: { before: current.status, after: target } };
    if (withdrawnReason !== current.withdrawnReason) changes['withdrawnReason'] = { before: current.withdrawnReason, after: withdrawnReason };
    await auditRepository.insertScanAudit(trx, { scanId, personId, action: 'status', changes });
    return getScan(trx, scanId);
  });
}

export async function listScanChangeLog(db: Db, scanId: string, query: PageQuery): Promise<Page<ScanChangeLogEntry>> {
  await getScan(db, scanId);
  const { items, total } = await auditRepository.listScanChangeLog(db, scanId, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

/** Sends a failed scan's derivative job again (409 unless it failed). */
export async function retryDerivatives(deps: ScanDeps, scanId: string): Promise<ScanDetail> {
  return deps.db.transaction().execute(async (trx) => {
    const current = await scansRepository.lockScan(trx, scanId);
    if (!current) throw scanNotFound();
    if (current.derivativeState !== 'failed') {
      throw new AppError(HTTP.conflict, 'derivatives_not_failed', `Only failed derivatives can be retried; these are ${current.derivativeState}.`);
    }
    await scansRepository.setDerivativeState(trx, scanId, 'queued', { error: current.derivativeError });
    await deps.jobs.enqueue(trx, [scanId]);
    return getScan(trx, scanId);
  });
}

/** Absolute path of the scan's JPEG preview, remade from its page when the cache lost it. */
export async function getPreviewPath(db: Db, storage: Storage, scanId: string): Promise<string> {
  const file = await scansRepository.findScanFile(db, scanId);
  if (!file) throw scanNotFound();
  const previewKey = storage.previewKey(file.sha256, file.pageIndex);
  if (!(await storage.exists(previewKey))) {
    const source = await findPageSource(storage, file);
    if (!source) throw new AppError(HTTP.conflict, 'derivatives_not_ready', 'The preview of this PDF page is not made yet; try again when its derivatives are ready.');
    const tempPath = storage.newTempPath('.jpg');
    try {
      if (file.mediaType === 'application/pdf' || file.mediaType === 'image/tiff') {
        await source.open().resize(PREVIEW_LONGEST_SIDE_PX, PREVIEW_LONGEST_SIDE_PX, { fit: 'inside', withoutEnlargement: true }).flatten({ background: '#ffffff' }).jpeg({ quality: 85 }).toFile(tempPath);
      } else {
        await writePreview(storage.pathOf(file.storageKey), tempPath, file.pageIndex);
      }
      await storage.putCache(tempPath, previewKey);
    } finally {
      await fs.rm(tempPath, { force: true });
    }
  }
  return storage.pathOf(previewKey);
}
