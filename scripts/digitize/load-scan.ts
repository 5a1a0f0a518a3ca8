import { readFile } from 'node:fs/promises';
import { extname } from 'node:path';
import sharp from 'sharp';
import type { RawImage } from '@shared/domain/ink/raw-image';

/** A decoded scan and how it was obtained. */
export interface LoadedScan {
  image: RawImage;
  /** 'sharp' for image files; 'pdf-embedded-image' when the first PDF page's largest image was taken as is. */
  source: 'sharp' | 'pdf-embedded-image' | 'pdf-rendered-page';
}

// pdfjs ImageKind values (pdfjs-dist src/shared/util.js).
const IMAGE_KIND_GREY_1BPP = 1;
const IMAGE_KIND_RGB_24BPP = 2;
const IMAGE_KIND_RGBA_32BPP = 3;
// Rendering scale for a PDF page without an embedded image: 300 dpi from PDF points (1/72 in).
const RENDER_SCALE = 300 / 72;

/** Decodes a PNG, JPEG or TIFF buffer to raw pixels (alpha dropped; grey stays one channel). */
export async function decodeImage(buffer: Buffer): Promise<RawImage> {
  const { data, info } = await sharp(buffer, { limitInputPixels: false }).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  return { data, width: info.width, height: info.height, channels: info.channels as RawImage['channels'] };
}

function isPdf(path: string, buffer: Buffer): boolean {
  return extname(path).toLowerCase() === '.pdf' || buffer.subarray(0, 5).toString('latin1') === '%PDF-';
}

/** Reads a scan: image files through sharp, PDFs through pdfjs-dist (first page only). */
export async function loadScan(path: string): Promise<LoadedScan> {
  const buffer = await readFile(path);
  if (isPdf(path, buffer)) return await loadPdfFirstPage(buffer);
  return { image: await decodeImage(buffer), source: 'sharp' };
}

interface PdfImageObject {
  width: number;
  height: number;
  kind?: number;
  data?: Uint8Array | Uint8ClampedArray;
  bitmap?: unknown;
}

/**
 * First page of a PDF. A scanned page holds one big image: we take the largest image the page paints, at its
 * own resolution (no resampling). Pages without one are rendered at 300 dpi on @napi-rs/canvas, which
 * pdfjs-dist 5 uses in Node.
 */
export async function loadPdfFirstPage(buffer: Buffer): Promise<LoadedScan> {
  const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs');
  const document = await pdfjs.getDocument({ data: new Uint8Array(buffer), isEvalSupported: false, useSystemFonts: false }).promise;
  try {
    const page = await document.getPage(1);
    const operators = await page.getOperatorList();
    const names: string[] = [];
    for (let i = 0; i < operators.fnArray.length; i++) {
      if (operators.fnArray[i] === pdfjs.OPS.paintImageXObject) names.push(String(operators.argsArray[i][0]));
    }
    let best: PdfImageObject | null = null;
    for (const name of names) {
      const store = name.startsWith('g_') ? page.commonObjs : page.objs;
      const object = (await new Promise((resolve) => store.get(name, resolve))) as PdfImageObject | null;
      if (object && object.data && (!best || object.width * object.height > best.width * best.height)) best = object;
    }
    if (best && best.data) return { image: imageFromPdfObject(best), source: 'pdf-embedded-image' };
    return { image: await renderPage(page), source: 'pdf-rendered-page' };
  } finally {
    await document.destroy();
  }
}

function imageFromPdfObject(object: PdfImageObject): RawImage {
  const data = object.data as Uint8Array | Uint8ClampedArray;
  const pixels = object.width * object.height;
  if (object.kind === IMAGE_KIND_RGB_24BPP) return { data, width: object.width, height: object.height, channels: 3 };
  if (object.kind === IMAGE_KIND_RGBA_32BPP) return { data, width: object.width, height: object.height, channels: 4 };
  if (object.kind === IMAGE_KIND_GREY_1BPP) {
    // One bit per pixel, rows padded to whole bytes: unpack to 0/255 grey.
    const grey = new Uint8Array(pixels);
    const rowBytes = Math.ceil(object.width / 8);
    for (let y = 0; y < object.height; y++) {
      for (let x = 0; x < object.width; x++) grey[y * object.width + x] = (data[y * rowBytes + (x >> 3)] >> (7 - (x & 7))) & 1 ? 255 : 0;
    }
    return { data: grey, width: object.width, height: object.height, channels: 1 };
  }
  throw new Error(`unsupported PDF image kind ${String(object.kind)}`);
}

interface PdfPage {
  getViewport(options: { scale: number }): { width: number; height: number };
  render(options: { canvas: unknown; canvasContext: unknown; viewport: unknown }): { promise: Promise<void> };
}

async function renderPage(page: unknown): Promise<RawImage> {
  const { createCanvas } = await import('@napi-rs/canvas');
  const pdfPage = page as PdfPage;
  const viewport = pdfPage.getViewport({ scale: RENDER_SCALE });
  const canvas = createCanvas(Math.ceil(viewport.width), Math.ceil(viewport.height));
  const context = canvas.getContext('2d');
  await pdfPage.render({ canvas, canvasContext: context, viewport }).promise;
  const rgba = context.getImageData(0, 0, canvas.width, canvas.height).data;
  return { data: new Uint8Array(rgba.buffer, rgba.byteOffset, rgba.byteLength), width: canvas.width, height: canvas.height, channels: 4 };
}
