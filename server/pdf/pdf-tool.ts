/**
 * PDF work in a child process of its own: `tsx server/pdf/pdf-tool.ts info <file>` prints the pages as JSON;
 * `… render <file> <pageIndex> <out.png>` writes one page raster. Parsing an untrusted PDF away from the
 * web server keeps its memory and any crash out of it, and pdfjs-dist (ESM only) loads here under plain tsx.
 */
import { writeFile } from 'node:fs/promises';
import { readFile } from 'node:fs/promises';
import sharp from 'sharp';

/** Render scale for a page without a scanned image: 300 dpi from PDF points (1/72 in). */
const RENDER_DPI = 300;

// pdfjs ImageKind values (pdfjs-dist src/shared/util.js).
const IMAGE_KIND_GREY_1BPP = 1;
const IMAGE_KIND_RGB_24BPP = 2;
const IMAGE_KIND_RGBA_32BPP = 3;

export interface PdfPageInfo {
  widthPx: number;
  heightPx: number;
  /** Resolution of the raster relative to the page's printed size. */
  dpi: number;
  /** 'image': the page's largest scanned image, taken at its own pixel size; 'render': drawn at 300 dpi. */
  source: 'image' | 'render';
}

export type PdfInfo = { ok: true; pages: PdfPageInfo[] } | { ok: false; problem: 'encrypted' | 'empty' | 'corrupt'; message: string };

interface PdfImageObject {
  width: number;
  height: number;
  kind?: number;
  data?: Uint8Array | Uint8ClampedArray;
}

type PdfJs = typeof import('pdfjs-dist/legacy/build/pdf.mjs');
type PdfDocument = Awaited<ReturnType<PdfJs['getDocument']>['promise']>;
type PdfPage = Awaited<ReturnType<PdfDocument['getPage']>>;

async function openDocument(filePath: string): Promise<{ pdfjs: PdfJs; document: PdfDocument }> {
  const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs');
  const data = new Uint8Array(await readFile(filePath));
  const document = await pdfjs.getDocument({ data, isEvalSupported: false, useSystemFonts: false, stopAtErrors: true }).promise;
  return { pdfjs, document };
}

async function largestImage(pdfjs: PdfJs, page: PdfPage): Promise<PdfImageObject | null> {
  const operators = await page.getOperatorList();
  let best: PdfImageObject | null = null;
  for (let i = 0; i < operators.fnArray.length; i++) {
    if (operators.fnArray[i] !== pdfjs.OPS.paintImageXObject) continue;
    const name = String(operators.argsArray[i][0]);
    const store = name.startsWith('g_') ? page.commonObjs : page.objs;
    const object = (await new Promise((resolve) => store.get(name, resolve))) as PdfImageObject | null;
    if (object && object.data && (!best || object.width * object.height > best.width * best.height)) best = object;
  }
  return best;
}

async function describePage(pdfjs: PdfJs, page: PdfPage): Promise<PdfPageInfo> {
  const viewport = page.getViewport({ scale: 1 });
  const image = await largestImage(pdfjs, page);
  if (image) return { widthPx: image.width, heightPx: image.height, dpi: Math.round((image.width * 72 * 100) / viewport.width) / 100, source: 'image' };
  const scale = RENDER_DPI / 72;
  return { widthPx: Math.ceil(viewport.width * scale), heightPx: Math.ceil(viewport.height * scale), dpi: RENDER_DPI, source: 'render' };
}

async function info(filePath: string): Promise<PdfInfo> {
  let opened: { pdfjs: PdfJs; document: PdfDocument };
  try {
    opened = await openDocument(filePath);
  } catch (error) {
    const name = (error as { name?: string }).name;
    if (name === 'PasswordException') return { ok: false, problem: 'encrypted', message: 'The PDF is encrypted (password protected).' };
    return { ok: false, problem: 'corrupt', message: `The PDF could not be read: ${(error as Error).message}` };
  }
  const { pdfjs, document } = opened;
  try {
    // An owner password alone still encrypts the file: a master must be readable without any key.
    if ((await document.getPermissions()) !== null) return { ok: false, problem: 'encrypted', message: 'The PDF is encrypted (it carries a security handler).' };
    if (document.numPages === 0) return { ok: false, problem: 'empty', message: 'The PDF has no pages.' };
    const pages: PdfPageInfo[] = [];
    for (let n = 1; n <= document.numPages; n++) pages.push(await describePage(pdfjs, await document.getPage(n)));
    return { ok: true, pages };
  } catch (error) {
    return { ok: false, problem: 'corrupt', message: `The PDF could not be read: ${(error as Error).message}` };
  } finally {
    await document.destroy();
  }
}

function rawFromImage(object: PdfImageObject): { data: Uint8Array; channels: 1 | 3 | 4 } {
  const data = object.data as Uint8Array;
  if (object.kind === IMAGE_KIND_RGB_24BPP) return { data, channels: 3 };
  if (object.kind === IMAGE_KIND_RGBA_32BPP) return { data, channels: 4 };
  if (object.kind === IMAGE_KIND_GREY_1BPP) {
    // One bit per pixel, rows padded to whole bytes: unpack to 0/255 grey.
    const grey = new Uint8Array(object.width * object.height);
    const rowBytes = Math.ceil(object.width / 8);
    for (let y = 0; y < object.height; y++) {
      for (let x = 0; x < object.width; x++) grey[y * object.width + x] = (data[y * rowBytes + (x >> 3)] >> (7 - (x & 7))) & 1 ? 255 : 0;
    }
    return { data: grey, channels: 1 };
  }
  throw new Error(`unsupported PDF image kind ${String(object.kind)}`);
}

async function render(filePath: string, pageIndex: number, outPath: string): Promise<void> {
  const { pdfjs, document } = await openDocument(filePath);
  try {
    const page = await document.getPage(pageIndex + 1);
    const image = await largestImage(pdfjs, page);
    if (image) {
      const { data, channels } = rawFromImage(image);
      await sharp(Buffer.from(data.buffer, data.byteOffset, data.byteLength), { raw: { width: image.width, height: image.height, channels } })
        .png({ compressionLevel: 6 })
        .toFile(outPath);
      return;
    }
    const { createCanvas } = await import('@napi-rs/canvas');
    const viewport = page.getViewport({ scale: RENDER_DPI / 72 });
    const canvas = createCanvas(Math.ceil(viewport.width), Math.ceil(viewport.height));
    const context = canvas.getContext('2d');
    context.fillStyle = '#ffffff';
    context.fillRect(0, 0, canvas.width, canvas.height);
    // @napi-rs/canvas stands in for the DOM canvas pdfjs types expect.
    await page.render({ canvas: canvas as never, canvasContext: context as never, viewport }).promise;
    await writeFile(outPath, canvas.toBuffer('image/png'));
  } finally {
    await document.destroy();
  }
}

async function main(args: string[]): Promise<void> {
  const [command, filePath, pageIndex, outPath] = args;
  if (command === 'info' && filePath) {
    process.stdout.write(JSON.stringify(await info(filePath)));
    return;
  }
  if (command === 'render' && filePath && pageIndex !== undefined && outPath) {
    await render(filePath, Number(pageIndex), outPath);
    return;
  }
  throw new Error('usage: pdf-tool info <file> | render <file> <pageIndex> <out.png>');
}

if (require.main === module) {
  main(process.argv.slice(2)).then(
    () => process.exit(0),
    (error: unknown) => {
      process.stderr.write(String(error instanceof Error ? error.message : error));
      process.exit(1);
    },
  );
}
