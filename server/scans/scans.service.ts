import fs from 'node:fs/promises';
import type { Page, PageQuery } from '@shared/api/paging';
import type { ScanDetail, ScanSortKey, ScanSummary, ScanUploadFields } from '@shared/api/scans';
import * as chartFormsService from '../chart-forms/chart-forms.service';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import * as stationsService from '../stations/stations.service';
import { sha256OfFile, type Storage } from '../storage/storage';
import { detectImageType, readImageSize, writePreview } from './scan-image';
import * as scansRepository from './scans.repository';
import type { ScanFilter } from './scans.repository';

/** A file already on disk in storage.tempDir, with the name the uploader gave it. */
export interface ReceivedFile {
  tempPath: string;
  originalName: string;
}

export interface ParsedUploadFields extends Omit<ScanUploadFields, 'periodStart'> {
  periodStart: Date;
}

function duplicateScan(scanId: string | undefined): AppError {
  return new AppError(HTTP.conflict, 'duplicate_scan', 'This file has been uploaded before.', { scanId });
}

async function removeQuietly(filePath: string): Promise<void> {
  await fs.rm(filePath, { force: true });
}

/**
 * Keeps an uploaded chart: checks station and chart form, reads the type from the bytes, refuses a
 * second copy of the same bytes, decodes it (which also makes the preview), stores the master by its
 * SHA-256 and inserts the row. The temp file is consumed; on failure nothing new is left on disk.
 */
export async function uploadScan(
  db: Db,
  storage: Storage,
  file: ReceivedFile,
  fields: ParsedUploadFields,
  uploadedBy: string,
): Promise<ScanDetail> {
  const previewTempPath = storage.newTempPath('.jpg');
  try {
    await stationsService.getStation(db, fields.stationId);
    await chartFormsService.getChartForm(db, fields.chartFormId);
    const { mediaType, extension } = await detectImageType(file.tempPath);
    const sha256 = await sha256OfFile(file.tempPath);
    const existingId = await scansRepository.findScanIdBySha256(db, sha256);
    if (existingId) throw duplicateScan(existingId);
    const { widthPx, heightPx } = await readImageSize(file.tempPath);
    await writePreview(file.tempPath, previewTempPath);
    const { size: sizeBytes } = await fs.stat(file.tempPath);

    const master = await storage.putMaster(file.tempPath, sha256, extension);
    const previewKey = storage.previewKey(sha256);
    try {
      await storage.putCache(previewTempPath, previewKey);
      const inserted = await scansRepository.insertScan(db, {
        sha256,
        storage_key: master.key,
        media_type: mediaType,
        size_bytes: sizeBytes,
        width_px: widthPx,
        height_px: heightPx,
        station_id: fields.stationId,
        chart_form_id: fields.chartFormId,
        period_start: fields.periodStart,
        // Station, chart form and period are all known, which is everything tracing needs.
        status: 'ready_to_trace',
        original_name: file.originalName,
        uploaded_by: uploadedBy,
      });
      if ('duplicateOf' in inserted) throw duplicateScan(inserted.duplicateOf);
      return await getScan(db, inserted.scanId);
    } catch (error) {
      // Only the upload that created the master may remove it: a same-hash master belongs to another row.
      if (master.isCreated) {
        await storage.remove(master.key);
        await storage.remove(previewKey);
      }
      throw error;
    }
  } finally {
    await removeQuietly(file.tempPath);
    await removeQuietly(previewTempPath);
  }
}

export async function listScans(db: Db, filter: ScanFilter, query: PageQuery<ScanSortKey>): Promise<Page<ScanSummary>> {
  const { items, total } = await scansRepository.listScans(db, filter, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

export async function getScan(db: Db, scanId: string): Promise<ScanDetail> {
  const scan = await scansRepository.findScanById(db, scanId);
  if (!scan) throw new AppError(HTTP.notFound, 'scan_not_found', 'There is no scan with this id.');
  return scan;
}

/** Absolute path of the scan's JPEG preview, remade from the master when the cache lost it. */
export async function getPreviewPath(db: Db, storage: Storage, scanId: string): Promise<string> {
  const file = await scansRepository.findScanFile(db, scanId);
  if (!file) throw new AppError(HTTP.notFound, 'scan_not_found', 'There is no scan with this id.');
  const previewKey = storage.previewKey(file.sha256);
  if (!(await storage.exists(previewKey))) {
    const tempPath = storage.newTempPath('.jpg');
    try {
      await writePreview(storage.pathOf(file.storageKey), tempPath);
      await storage.putCache(tempPath, previewKey);
    } finally {
      await removeQuietly(tempPath);
    }
  }
  return storage.pathOf(previewKey);
}
