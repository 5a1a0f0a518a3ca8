import sharp from 'sharp';
import { AppError, HTTP } from '../errors/app-error';
import { readPdfInfo } from '../pdf/pdf-pages';
import { decodeFailure, detectMasterType, MAX_INPUT_PIXELS, MAX_PAGES, tooManyPixels, writePreview } from './scan-image';

/** One page of a master as the catalogue records it. */
export interface MasterPage {
  widthPx: number;
  heightPx: number;
  /** From the file's own metadata; null when it carries none (the archivist is asked). */
  dpi: number | null;
  /** EXIF orientation 1–8, or null. */
  orientation: number | null;
}

export interface InspectedMaster {
  mediaType: string;
  extension: string;
  pages: MasterPage[];
}

function toOrientation(value: number | undefined): number | null {
  return value !== undefined && Number.isInteger(value) && value >= 1 && value <= 8 ? value : null;
}

/** sharp reports density in pixels per inch; a TIFF or PNG without resolution metadata says 72, which is no information. */
function toDpi(density: number | undefined): number | null {
  return density !== undefined && density > 0 && density !== 72 ? Math.round(density * 100) / 100 : null;
}

/** Reads headers only (no decoding): pixel sizes are checked against MAX_INPUT_PIXELS before anything is decoded. */
async function inspectRaster(filePath: string): Promise<MasterPage[]> {
  let first: sharp.Metadata;
  try {
    first = await sharp(filePath, { limitInputPixels: false }).metadata();
  } catch (error) {
    throw decodeFailure(error);
  }
  const pageCount = first.pages ?? 1;
  if (pageCount > MAX_PAGES) throw new AppError(HTTP.payloadTooLarge, 'image_too_large', `The file has ${pageCount} pages; at most ${MAX_PAGES} are accepted.`);
  const pages: MasterPage[] = [];
  for (let pageIndex = 0; pageIndex < pageCount; pageIndex++) {
    const metadata = pageIndex === 0 ? first : await sharp(filePath, { limitInputPixels: false, page: pageIndex }).metadata().catch(decodeFailure);
    if (metadata instanceof AppError) throw metadata;
    // For a multi-page TIFF, metadata.height is the page's own height when opened with `page`.
    const widthPx = metadata.width ?? 0;
    const heightPx = metadata.pageHeight ?? metadata.height ?? 0;
    if (widthPx <= 0 || heightPx <= 0) throw decodeFailure(new Error('no dimensions'));
    if (widthPx * heightPx > MAX_INPUT_PIXELS) throw tooManyPixels(widthPx, heightPx);
    pages.push({ widthPx, heightPx, dpi: toDpi(metadata.density), orientation: toOrientation(metadata.orientation) });
  }
  return pages;
}

async function inspectPdf(filePath: string): Promise<MasterPage[]> {
  const info = await readPdfInfo(filePath);
  if (!info.ok) {
    if (info.problem === 'corrupt') throw new AppError(HTTP.unprocessable, 'corrupt_image', `${info.message} It may be damaged or cut short.`);
    throw new AppError(HTTP.unprocessable, 'unreadable_pdf', info.message, { problem: info.problem });
  }
  if (info.pages.length > MAX_PAGES) throw new AppError(HTTP.payloadTooLarge, 'image_too_large', `The PDF has ${info.pages.length} pages; at most ${MAX_PAGES} are accepted.`);
  for (const page of info.pages) if (page.widthPx * page.heightPx > MAX_INPUT_PIXELS) throw tooManyPixels(page.widthPx, page.heightPx);
  return info.pages.map((page) => ({ widthPx: page.widthPx, heightPx: page.heightPx, dpi: page.dpi, orientation: null }));
}

/**
 * What a file is and what pages it holds, or the AppError that refuses it: 415 for bytes that are not an
 * image or PDF, 413 image_too_large for a decompression bomb (checked from the header), 422 for a PDF
 * that is encrypted or has no pages.
 */
export async function inspectMaster(filePath: string): Promise<InspectedMaster> {
  const { mediaType, extension } = await detectMasterType(filePath);
  const pages = mediaType === 'application/pdf' ? await inspectPdf(filePath) : await inspectRaster(filePath);
  return { mediaType, extension, pages };
}

/**
 * Decodes every page of a raster master fully, writing each page's preview to `previewPathOf(page)`:
 * a truncated or damaged file fails here (422 corrupt_image), before the master is kept. PDFs were
 * parsed completely by inspectMaster and are rasterised by the worker.
 */
export async function decodeRasterPages(filePath: string, master: InspectedMaster, previewPathOf: (pageIndex: number) => string): Promise<void> {
  if (master.mediaType === 'application/pdf') return;
  for (let pageIndex = 0; pageIndex < master.pages.length; pageIndex++) await writePreview(filePath, previewPathOf(pageIndex), pageIndex);
}
