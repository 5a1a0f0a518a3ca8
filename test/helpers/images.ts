import sharp from 'sharp';

let variant = 0;

/**
 * A small RGB test image. Each call differs in one pixel row, so two calls never give the same bytes
 * (uploads are refused as duplicates by content hash).
 */
async function makeImage(widthPx: number, heightPx: number, format: 'png' | 'jpeg'): Promise<Buffer> {
  variant += 1;
  const pixels = Buffer.alloc(widthPx * heightPx * 3, 235);
  for (let x = 0; x < widthPx; x++) {
    const offset = ((variant % heightPx) * widthPx + x) * 3;
    pixels[offset] = (variant * 37) % 256;
    pixels[offset + 1] = (variant * 91 + x) % 256;
    pixels[offset + 2] = 40;
  }
  const image = sharp(pixels, { raw: { width: widthPx, height: heightPx, channels: 3 } });
  return format === 'png' ? image.png().toBuffer() : image.jpeg({ quality: 90 }).toBuffer();
}

export function makePng(widthPx = 64, heightPx = 48): Promise<Buffer> {
  return makeImage(widthPx, heightPx, 'png');
}

export function makeJpeg(widthPx = 64, heightPx = 48): Promise<Buffer> {
  return makeImage(widthPx, heightPx, 'jpeg');
}

/** A PNG cut off part-way through its image data: the signature and header are fine, the pixels are not. */
export async function makeTruncatedPng(widthPx = 256, heightPx = 256): Promise<Buffer> {
  const whole = await makeImage(widthPx, heightPx, 'png');
  return whole.subarray(0, Math.floor(whole.length * 0.6));
}

/** A GIF89a header and a few bytes: a real image type that Isallo does not accept. */
export function makeGifBytes(): Buffer {
  return Buffer.concat([Buffer.from('GIF89a', 'ascii'), Buffer.from([1, 0, 1, 0, 0x80, 0, 0, 0, 0, 0, 255, 255, 255, 0x2c, 0, 0, 0, 0, 1, 0, 1, 0, 0, 2, 2, 0x44, 1, 0, 0x3b])]);
}
