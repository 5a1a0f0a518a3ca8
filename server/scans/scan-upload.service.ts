import fs from 'node:fs/promises';
import type { ScanDetail } from '@shared/api/scans';
import type { Insertable } from 'kysely';
import * as auditRepository from '../audit/scan-audit.repository';
import * as chartFormsService from '../chart-forms/chart-forms.service';
import { AppError, HTTP } from '../errors/app-error';
import * as stationsService from '../stations/stations.service';
import { sha256OfFile } from '../storage/storage';
import { decodeRasterPages, inspectMaster } from './master-file';
import type { ScanDeps } from './scan-deps';
import type { ScanTable } from './scan.table';
import * as scansRepository from './scans.repository';

/** A file already on disk in storage.tempDir, with the name the uploader gave it (and its hash, when multer made one). */
export interface ReceivedFile {
  tempPath: string;
  originalName: string;
  sha256?: string;
}

/** Catalogue fields an upload may carry; all three of station, form and chart start make a one-page scan ready to trace. */
export interface ParsedUploadFields {
  stationId?: string;
  chartFormId?: string;
  chartStart?: Date;
  batchId?: string;
}

/** 409 duplicate_scan naming the first page's scan of the master that already holds these bytes. */
export function duplicateScan(existingScanId: string | undefined): AppError {
  return new AppError(HTTP.conflict, 'duplicate_scan', 'This file has been uploaded before.', { scanId: existingScanId, existingScanId });
}

/** Thrown inside the insert transaction when a copy committed first, to roll it back; answered as duplicateScan outside. */
class LostToCopy extends Error {}

/**
 * Keeps an uploaded master: checks station and chart form, reads the type and pages from the bytes (refusing
 * bombs from the header), refuses a second copy of the same bytes, decodes every raster page (which makes its
 * preview and finds damage), stores the master by its SHA-256 and, in one transaction, inserts one scan per
 * page, their audit rows and their derivative jobs. The temp file is consumed; on failure nothing new is left.
 */
export async function uploadMaster(deps: ScanDeps, file: ReceivedFile, fields: ParsedUploadFields, uploadedBy: string): Promise<ScanDetail[]> {
  const { db, storage } = deps;
  const previewTemps = new Map<number, string>();
  const previewTempOf = (pageIndex: number) => {
    const tempPath = previewTemps.get(pageIndex) ?? storage.newTempPath('.jpg');
    previewTemps.set(pageIndex, tempPath);
    return tempPath;
  };
  try {
    if (fields.stationId) await stationsService.getStation(db, fields.stationId);
    if (fields.chartFormId) await chartFormsService.getChartForm(db, fields.chartFormId);
    const master = await inspectMaster(file.tempPath);
    const sha256 = file.sha256 ?? (await sha256OfFile(file.tempPath));
    const existingId = await scansRepository.findScanIdBySha256(db, sha256);
    if (existingId) throw duplicateScan(existingId);
    await decodeRasterPages(file.tempPath, master, previewTempOf);
    const { size: sizeBytes } = await fs.stat(file.tempPath);

    const stored = await storage.putMaster(file.tempPath, sha256, master.extension);
    const previewKeys = [...previewTemps.keys()].map((pageIndex) => storage.previewKey(sha256, pageIndex));
    try {
      const isSinglePage = master.pages.length === 1;
      // A chart start belongs to one chart: on a many-page master it is set page by page later.
      const chartStart = isSinglePage ? (fields.chartStart ?? null) : null;
      const rows: Insertable<ScanTable>[] = master.pages.map((page, pageIndex) => ({
        sha256,
        storage_key: stored.key,
        media_type: master.mediaType,
        size_bytes: sizeBytes,
        width_px: page.widthPx,
        height_px: page.heightPx,
        page_index: pageIndex,
        page_count: master.pages.length,
        dpi: page.dpi,
        orientation: page.orientation,
        station_id: fields.stationId ?? null,
        chart_form_id: fields.chartFormId ?? null,
        chart_start: chartStart,
        batch_id: fields.batchId ?? null,
        // Never ready to trace before its derivatives exist (the status route's rule): the worker moves a
        // scan uploaded with station, chart form and chart start once they are made (ready-after-derivatives.ts).
        status: 'received',
        original_name: file.originalName,
        uploaded_by: uploadedBy,
      }));
      const scanIds = await db
        .transaction()
        .execute(async (trx) => {
          const inserted = await scansRepository.insertScans(trx, rows);
          if ('duplicateOf' in inserted) throw new LostToCopy();
          await auditRepository.insertScanAudit(
            trx,
            ...inserted.scanIds.map((scanId, pageIndex) => ({
              scanId,
              personId: uploadedBy,
              action: 'upload' as const,
              changes: { originalName: { before: null, after: file.originalName }, pageIndex: { before: null, after: pageIndex }, status: { before: null, after: rows[pageIndex].status } },
            })),
          );
          await deps.jobs.enqueue(trx, inserted.scanIds);
          return inserted.scanIds;
        })
        .catch(async (error: unknown) => {
          // The winner is looked up after the rollback: its rows are committed by now (that is why the unique
          // index refused ours), and this request holds no pooled connection while it asks for another.
          if (error instanceof LostToCopy) throw duplicateScan(await scansRepository.findScanIdBySha256(db, sha256));
          throw error;
        });
      for (const [pageIndex, tempPath] of previewTemps) await storage.putCache(tempPath, storage.previewKey(sha256, pageIndex));
      const scans: ScanDetail[] = [];
      for (const scanId of scanIds) scans.push((await scansRepository.findScanById(db, scanId)) as ScanDetail);
      return scans;
    } catch (error) {
      // Only the upload that created the master may remove it, and only while no row points at it: when two
      // copies race, the loser may be the one whose link made the file the winner's row now names.
      if (stored.isCreated && !(await scansRepository.findScanIdBySha256(db, sha256))) {
        await storage.remove(stored.key);
        for (const key of previewKeys) await storage.remove(key);
      }
      throw error;
    }
  } finally {
    await fs.rm(file.tempPath, { force: true });
    for (const tempPath of previewTemps.values()) await fs.rm(tempPath, { force: true });
  }
}
