import fileType from 'file-type';
import sharp from 'sharp';
import { AppError, HTTP } from '../errors/app-error';

/** Media types accepted today, with the extension their masters get. TIFF and PDF come later. */
export const ACCEPTED_IMAGE_TYPES: Record<string, string> = { 'image/png': 'png', 'image/jpeg': 'jpg' };

/**
 * Largest image sharp will decode, in pixels. A 600 dpi weekly chart is about 7 000 × 2 600 px;
 * 150 MP leaves room for 1 200 dpi scans while refusing decompression bombs.
 */
export const MAX_INPUT_PIXELS = 150_000_000;

/** Longest side of a preview, px. */
export const PREVIEW_LONGEST_SIDE_PX = 2400;

/** The media type of a file, read from its first bytes (never from its name), or 415. */
export async function detectImageType(filePath: string): Promise<{ mediaType: string; extension: string }> {
  const detected = await fileType.fromFile(filePath);
  const extension = detected ? ACCEPTED_IMAGE_TYPES[detected.mime] : undefined;
  if (!detected || !extension) {
    throw new AppError(
      HTTP.unsupportedMediaType,
      'unsupported_file_type',
      `Only PNG and JPEG scans can be uploaded${detected ? ` (this file is ${detected.mime})` : ''}.`,
    );
  }
  return { mediaType: detected.mime, extension };
}

function decodeFailure(error: unknown): AppError {
  const message = error instanceof Error ? error.message : String(error);
  if (/pixel limit/i.test(message)) {
    return new AppError(HTTP.payloadTooLarge, 'file_too_large', `The image has more than ${MAX_INPUT_PIXELS} pixels.`);
  }
  return new AppError(HTTP.unprocessable, 'corrupt_image', 'The image could not be read; it may be damaged or cut short.');
}

function openImage(filePath: string): sharp.Sharp {
  // failOn 'truncated' refuses a file that stops early but accepts the harmless warnings old scanners cause.
  return sharp(filePath, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'truncated' });
}

/** Width and height of the stored pixel grid (EXIF orientation is not applied: pins are on raw pixels). */
export async function readImageSize(filePath: string): Promise<{ widthPx: number; heightPx: number }> {
  try {
    const metadata = await openImage(filePath).metadata();
    if (!metadata.width || !metadata.height) throw new Error('no dimensions');
    return { widthPx: metadata.width, heightPx: metadata.height };
  } catch (error) {
    throw decodeFailure(error);
  }
}

/**
 * Decodes the whole image and writes a JPEG preview (longest side ≤ PREVIEW_LONGEST_SIDE_PX, never enlarged).
 * Decoding everything is also what finds a damaged file, so this runs before the master is kept.
 */
export async function writePreview(sourcePath: string, targetPath: string): Promise<void> {
  try {
    await openImage(sourcePath)
      .resize(PREVIEW_LONGEST_SIDE_PX, PREVIEW_LONGEST_SIDE_PX, { fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 85, mozjpeg: false })
      .toFile(targetPath);
  } catch (error) {
    throw decodeFailure(error);
  }
}
