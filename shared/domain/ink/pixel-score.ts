import type { InkContrast } from './ink-contrast';
import { readLut } from './lab-contrast';

export { lutIndex } from './lab-contrast';
import type { RawImage } from './raw-image';

/** Ink score of one pixel (about 1 on full ink, about 0 on paper and grid), for code off the hot loops. */
export type PixelScore = (x: number, y: number) => number;

/** The contrast's score at pixel (x, y), clamped to the image. */
export function pixelScorer(image: RawImage, contrast: InkContrast): PixelScore {
  const { data, width, height, channels } = image;
  const isColour = channels >= 3;
  const { offset, wr, wg, wb, lut } = contrast;
  return (x, y) => {
    const xi = Math.min(width - 1, Math.max(0, Math.floor(x)));
    const yi = Math.min(height - 1, Math.max(0, Math.floor(y)));
    const k = (yi * width + xi) * channels;
    if (!isColour) return offset - (wr + wg + wb) * data[k];
    if (lut) return readLut(lut, data[k], data[k + 1], data[k + 2]);
    return offset - (wr * data[k] + wg * data[k + 1] + wb * data[k + 2]);
  };
}
