import type { RawImage } from '@shared/domain/ink/raw-image';

/**
 * The Bench image's pixels, read once into memory so that a click can be snapped to the printed crossing
 * under it without a round trip. Null until the image has been decoded (or when the browser cannot draw it).
 */
export class PreviewPixels {
  private pixels: RawImage | null = null;
  private loadingUrl: string | null = null;

  /** The decoded image as RGBA rows, or null while none is loaded. */
  get image(): RawImage | null {
    return this.pixels;
  }

  /** Decodes the image at `url` (an object URL of the Bench image); a later call for another URL wins. */
  async load(url: string): Promise<void> {
    this.loadingUrl = url;
    this.pixels = null;
    const image = new Image();
    image.src = url;
    await image.decode();
    if (this.loadingUrl !== url) return;
    const canvas = document.createElement('canvas');
    canvas.width = image.naturalWidth;
    canvas.height = image.naturalHeight;
    const context = canvas.getContext('2d', { willReadFrequently: true });
    if (!context) return;
    context.drawImage(image, 0, 0);
    const data = context.getImageData(0, 0, canvas.width, canvas.height).data;
    this.pixels = { data, width: canvas.width, height: canvas.height, channels: 4 };
  }
}
