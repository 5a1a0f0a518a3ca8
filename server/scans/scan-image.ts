import fileType from 'file-type';
import sharp from 'sharp';
import { AppError, HTTP } from '../errors/app-error';

/** Media types a master may have, with the extension its file gets. */
export const ACCEPTED_MEDIA_TYPES: Record<string, string> = {
  'image/png': 'png',
  'image/jpeg': 'jpg',
  'image/tiff': 'tif',
  'application/pdf': 'pdf',
};

/**
 * Largest image (per page) Isallo will decode, in pixels. A 600 dpi weekly chart is about 7 000 × 2 600 px;
 * 150 MP leaves room for 1 200 dpi scans while refusing decompression bombs.
 */
export const MAX_INPUT_PIXELS = 150_000_000;
/** Most pages one master may have (a box's charts are scanned one file per chart or per folder). */
export const MAX_PAGES = 500;

/** Longest side of a preview, px. */
export const PREVIEW_LONGEST_SIDE_PX = 2400;
/** Longest side of a thumbnail, px. */
export const THUMBNAIL_LONGEST_SIDE_PX = 256;

/** The media type of a file, read from its first bytes (never from its name), or 415. */
export async function detectMasterType(filePath: string): Promise<{ mediaType: string; extension: string }> {
  const detected = await fileType.fromFile(filePath);
  const extension = detected ? ACCEPTED_MEDIA_TYPES[detected.mime] : undefined;
  if (!detected || !extension) {
    throw new AppError(
      HTTP.unsupportedMediaType,
      'unsupported_file_type',
      `Only TIFF, JPEG, PNG and PDF scans can be uploaded${detected ? ` (this file is ${detected.mime})` : ' (these bytes are not an image or a PDF)'}.`,
    );
  }
  return { mediaType: detected.mime, extension };
}

export function tooManyPixels(widthPx: number, heightPx: number): AppError {
  return new AppError(
    HTTP.payloadTooLarge,
    'image_too_large',
    `The image is ${widthPx} × ${heightPx} px (${Math.round((widthPx * heightPx) / 1e6)} MP), more than the ${MAX_INPUT_PIXELS / 1e6} MP Isallo decodes; it was refused before decoding.`,
    { widthPx, heightPx, maxPixels: MAX_INPUT_PIXELS },
  );
}

export function decodeFailure(error: unknown): AppError {
  const message = error instanceof Error ? error.message : String(error);
  if (/pixel limit/i.test(message)) return new AppError(HTTP.payloadTooLarge, 'image_too_large', `The image has more than ${MAX_INPUT_PIXELS} pixels.`);
  return new AppError(HTTP.unprocessable, 'corrupt_image', 'The image could not be read; it may be damaged or cut short.');
}

/** Opens one page of a raster master for decoding, refusing truncated data and oversized images. */
export function openRasterPage(filePath: string, pageIndex = 0): sharp.Sharp {
  // failOn 'truncated' refuses a file that stops early but accepts the harmless warnings old scanners cause.
  return sharp(filePath, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'truncated', page: pageIndex });
}

/**
 * Decodes the whole page and writes a JPEG preview (longest side ≤ PREVIEW_LONGEST_SIDE_PX, never enlarged).
 * Decoding everything is also what finds a damaged file, so uploads run it before the master is kept.
 */
export async function writePreview(sourcePath: string, targetPath: string, pageIndex = 0): Promise<void> {
  try {
    await openRasterPage(sourcePath, pageIndex)
      .resize(PREVIEW_LONGEST_SIDE_PX, PREVIEW_LONGEST_SIDE_PX, { fit: 'inside', withoutEnlargement: true })
      .flatten({ background: '#ffffff' })
      .jpeg({ quality: 85, mozjpeg: false })
      .toFile(targetPath);
  } catch (error) {
    throw decodeFailure(error);
  }
}
