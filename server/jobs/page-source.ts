import fs from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';
import type { ScanFile } from '../scans/scans.repository';
import type { Storage } from '../storage/storage';
import { MAX_INPUT_PIXELS } from '../scans/scan-image';

/** File name of a page raster inside a page's derivatives folder: a tiled, pyramidal TIFF, so any region reads fast. */
export const PAGE_RASTER_FILE = 'page.tif';

/** Masters that need a page raster (one page of many, or a PDF); PNG and JPEG masters are read as they are. */
export function needsPageRaster(mediaType: string): boolean {
  return mediaType === 'application/pdf' || mediaType === 'image/tiff';
}

/** A sharp pipeline over the scan's page pixels (raw pixel grid: EXIF orientation is not applied, pins sit on raw pixels). */
export interface PageSource {
  open(): sharp.Sharp;
}

/**
 * The pixels of a scan's page: the page raster the worker made, else the master itself (PNG, JPEG, or the
 * TIFF page); null for a PDF page whose raster the worker has not made yet.
 */
export async function findPageSource(storage: Storage, file: ScanFile): Promise<PageSource | null> {
  const rasterPath = path.join(storage.pathOf(storage.derivativesKey(file.sha256, file.pageIndex)), PAGE_RASTER_FILE);
  const hasRaster = await fs.access(rasterPath).then(
    () => true,
    () => false,
  );
  if (hasRaster) return { open: () => sharp(rasterPath, { limitInputPixels: MAX_INPUT_PIXELS }) };
  if (file.mediaType === 'application/pdf') return null;
  const masterPath = storage.pathOf(file.storageKey);
  return { open: () => sharp(masterPath, { limitInputPixels: MAX_INPUT_PIXELS, page: file.pageIndex }) };
}
