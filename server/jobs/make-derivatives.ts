import fs from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';
import { IIIF_TILE_SIZE_PX } from '@shared/api/routes';
import { renderPdfPage } from '../pdf/pdf-pages';
import { MAX_INPUT_PIXELS, PREVIEW_LONGEST_SIDE_PX, THUMBNAIL_LONGEST_SIDE_PX } from '../scans/scan-image';
import type { ScanFile } from '../scans/scans.repository';
import type { Storage } from '../storage/storage';
import { needsPageRaster, PAGE_RASTER_FILE } from './page-source';

/** Names inside a page's derivatives folder. */
export const THUMBNAIL_FILE = 'thumbnail.jpg';
export const TILES_FOLDER = 'tiles';

/**
 * Makes one page's derivatives from its master: the page raster (PDF and TIFF pages), a thumbnail (256 px),
 * the preview (2400 px) and the IIIF Image 3.0 tile pyramid (512 px tiles). Everything is written into a
 * fresh temp folder and swapped into place at the end, so a crash half-way leaves the old set (or none)
 * and the job can simply run again. The master is only ever read.
 */
export async function makeDerivatives(storage: Storage, file: ScanFile): Promise<void> {
  const workFolder = storage.newTempPath('.derivatives');
  await fs.mkdir(workFolder, { recursive: true });
  const previewTemp = storage.newTempPath('.jpg');
  try {
    const masterPath = storage.pathOf(file.storageKey);
    let sourcePath = masterPath;
    let page: number | undefined = file.pageIndex;
    if (needsPageRaster(file.mediaType)) {
      const rasterPath = path.join(workFolder, PAGE_RASTER_FILE);
      if (file.mediaType === 'application/pdf') {
        const pngPath = path.join(workFolder, 'page.png');
        await renderPdfPage(masterPath, file.pageIndex, pngPath);
        await writePyramidTiff(sharp(pngPath, { limitInputPixels: MAX_INPUT_PIXELS }), rasterPath);
        await fs.rm(pngPath, { force: true });
      } else {
        await writePyramidTiff(sharp(masterPath, { limitInputPixels: MAX_INPUT_PIXELS, page: file.pageIndex }), rasterPath);
      }
      sourcePath = rasterPath;
      page = undefined;
    }
    const open = () => sharp(sourcePath, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'truncated', ...(page !== undefined ? { page } : {}) });

    await open()
      .resize(THUMBNAIL_LONGEST_SIDE_PX, THUMBNAIL_LONGEST_SIDE_PX, { fit: 'inside', withoutEnlargement: true })
      .flatten({ background: '#ffffff' })
      .jpeg({ quality: 80 })
      .toFile(path.join(workFolder, THUMBNAIL_FILE));
    await open()
      .resize(PREVIEW_LONGEST_SIDE_PX, PREVIEW_LONGEST_SIDE_PX, { fit: 'inside', withoutEnlargement: true })
      .flatten({ background: '#ffffff' })
      .jpeg({ quality: 85 })
      .toFile(previewTemp);
    // libvips names the files {region}/{w},{h}/0/default.jpg under the folder, the IIIF Image 3.0 canonical form.
    await open()
      .flatten({ background: '#ffffff' })
      .jpeg({ quality: 85 })
      .tile({ size: IIIF_TILE_SIZE_PX, overlap: 0, layout: 'iiif3', id: 'isallo', basename: TILES_FOLDER })
      .toFile(path.join(workFolder, TILES_FOLDER));

    await storage.putFolder(workFolder, storage.derivativesKey(file.sha256, file.pageIndex));
    await storage.putCache(previewTemp, storage.previewKey(file.sha256, file.pageIndex));
  } finally {
    await fs.rm(workFolder, { recursive: true, force: true });
    await fs.rm(previewTemp, { force: true });
  }
}

/** A tiled, pyramidal, lossless TIFF: IIIF requests for any region read only the tiles they need. */
async function writePyramidTiff(image: sharp.Sharp, outPath: string): Promise<void> {
  await image.tiff({ tile: true, tileWidth: 256, tileHeight: 256, pyramid: true, compression: 'deflate' }).toFile(outPath);
}
