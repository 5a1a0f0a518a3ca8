import zlib from 'node:zlib';
import sharp from 'sharp';

let variant = 0;

/** A small RGB page that differs from every other call's (so uploads are never duplicates by content hash). */
async function makePage(widthPx: number, heightPx: number): Promise<sharp.Sharp> {
  variant += 1;
  const pixels = Buffer.alloc(widthPx * heightPx * 3, 230);
  for (let x = 0; x < widthPx; x++) {
    const offset = ((variant % heightPx) * widthPx + x) * 3;
    pixels[offset] = (variant * 53) % 256;
    pixels[offset + 1] = (variant * 17 + x) % 256;
    pixels[offset + 2] = 30;
  }
  return sharp(pixels, { raw: { width: widthPx, height: heightPx, channels: 3 } });
}

/** A multi-page TIFF (one chart per page), with a resolution of `dpi` in its header. */
export async function makeMultiPageTiff(pageCount: number, widthPx = 120, heightPx = 60, dpi = 300): Promise<Buffer> {
  const pages: Buffer[] = [];
  for (let i = 0; i < pageCount; i++) pages.push(await (await makePage(widthPx, heightPx)).png().toBuffer());
  return sharp(pages, { join: { animated: true } }).tiff({ compression: 'lzw' }).withMetadata({ density: dpi }).toBuffer();
}

/** A JPEG with a resolution of `dpi` in its JFIF header. */
export async function makeJpegWithDpi(widthPx: number, heightPx: number, dpi: number): Promise<Buffer> {
  return (await makePage(widthPx, heightPx)).jpeg({ quality: 90 }).withMetadata({ density: dpi }).toBuffer();
}

/** Assembles numbered PDF objects into a file with a cross-reference table (PDF 1.4, written by hand). */
function assemblePdf(objects: Buffer[], trailerExtra = ''): Buffer {
  const parts: Buffer[] = [Buffer.from('%PDF-1.4\n%\xE2\xE3\xCF\xD3\n', 'latin1')];
  const offsets: number[] = [];
  let length = parts[0].length;
  objects.forEach((body, i) => {
    offsets.push(length);
    const chunk = Buffer.concat([Buffer.from(`${i + 1} 0 obj\n`), body, Buffer.from('\nendobj\n')]);
    parts.push(chunk);
    length += chunk.length;
  });
  const xref =
    `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n` +
    offsets.map((offset) => `${String(offset).padStart(10, '0')} 00000 n \n`).join('') +
    `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R ${trailerExtra}>>\nstartxref\n${length}\n%%EOF\n`;
  parts.push(Buffer.from(xref));
  return Buffer.concat(parts);
}

/**
 * A PDF of `pageCount` scanned pages: each page is one JPEG image at `dpi`, the way a scanner's
 * "scan to PDF" stores them. Objects: 1 catalog, 2 pages, then per page: page, image, content.
 */
export async function makeScannedPdf(pageCount: number, widthPx = 150, heightPx = 75, dpi = 150, trailerExtra = ''): Promise<Buffer> {
  const widthPt = ((widthPx * 72) / dpi).toFixed(3);
  const heightPt = ((heightPx * 72) / dpi).toFixed(3);
  const objects: Buffer[] = [Buffer.from('<< /Type /Catalog /Pages 2 0 R >>')];
  const kids = Array.from({ length: pageCount }, (_, i) => `${3 + i * 3} 0 R`).join(' ');
  objects.push(Buffer.from(`<< /Type /Pages /Kids [${kids}] /Count ${pageCount} >>`));
  for (let i = 0; i < pageCount; i++) {
    const pageObject = 3 + i * 3;
    const jpeg = await (await makePage(widthPx, heightPx)).jpeg({ quality: 90 }).toBuffer();
    const content = `q ${widthPt} 0 0 ${heightPt} 0 0 cm /Scan Do Q`;
    objects.push(
      Buffer.from(
        `<< /Type /Page /Parent 2 0 R /MediaBox [0 0 ${widthPt} ${heightPt}] /Resources << /XObject << /Scan ${pageObject + 1} 0 R >> >> /Contents ${pageObject + 2} 0 R >>`,
      ),
    );
    objects.push(
      Buffer.concat([
        Buffer.from(`<< /Type /XObject /Subtype /Image /Width ${widthPx} /Height ${heightPx} /ColorSpace /DeviceRGB /BitsPerComponent 8 /Filter /DCTDecode /Length ${jpeg.length} >>\nstream\n`),
        jpeg,
        Buffer.from('\nendstream'),
      ]),
    );
    objects.push(Buffer.from(`<< /Length ${content.length} >>\nstream\n${content}\nendstream`));
  }
  return assemblePdf(objects, trailerExtra);
}

/** A well-formed PDF whose page tree is empty. */
export function makeEmptyPdf(): Buffer {
  return assemblePdf([Buffer.from('<< /Type /Catalog /Pages 2 0 R >>'), Buffer.from('<< /Type /Pages /Kids [] /Count 0 >>')]);
}

/**
 * A PDF that names the standard security handler (RC4, revision 2) in its trailer. Its /U entry does not
 * match the empty user password, so a reader needs a password it does not have.
 */
export async function makeEncryptedPdf(): Promise<Buffer> {
  const hex32 = (seed: number) => Buffer.from(Array.from({ length: 32 }, (_, i) => (seed * 31 + i * 7) % 256)).toString('hex');
  const fileId = Buffer.from('isallo-test-encrypted-file-id-01').toString('hex').slice(0, 32);
  // The /Encrypt dictionary is placed inline in the trailer, which the PDF syntax allows.
  const encrypt = `/Encrypt << /Filter /Standard /V 1 /R 2 /Length 40 /O <${hex32(3)}> /U <${hex32(5)}> /P -44 >> /ID [<${fileId}> <${fileId}>] `;
  return makeScannedPdf(1, 60, 30, 150, encrypt);
}

function pngChunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const typeAndData = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(zlib.crc32(typeAndData) >>> 0);
  return Buffer.concat([length, typeAndData, crc]);
}

/**
 * A decompression bomb: a PNG whose header claims widthPx × heightPx pixels (default 60 000 × 60 000,
 * 3.6 gigapixels) while the file is a few hundred bytes of compressed zero rows.
 */
export function makeBombPng(widthPx = 60_000, heightPx = 60_000): Buffer {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(widthPx, 0);
  header.writeUInt32BE(heightPx, 4);
  header[8] = 8; // bit depth
  header[9] = 0; // greyscale
  // A few rows of zeros; the rest of the image data is simply missing.
  const rows = zlib.deflateSync(Buffer.alloc((widthPx + 1) * 4));
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), pngChunk('IHDR', header), pngChunk('IDAT', rows), pngChunk('IEND', Buffer.alloc(0))]);
}
