/**
 * Decoded pixels as sharp's `.raw()` gives them: rows top to bottom, channels interleaved
 * (1 grey, 2 grey+alpha, 3 RGB, 4 RGBA). Pixel column i covers x in [i, i + 1).
 */
export interface RawImage {
  data: Uint8Array | Uint8ClampedArray;
  width: number;
  height: number;
  channels: 1 | 2 | 3 | 4;
}

/** An RGB colour, 0–255 per channel. */
export interface InkColour {
  r: number;
  g: number;
  b: number;
}

/** True when the image carries colour (3 or 4 channels). */
export function isColourImage(image: RawImage): boolean {
  return image.channels >= 3;
}

/** Parses '#rrggbb' (case-insensitive); null when it is not one. */
export function parseHexColour(hex: string): InkColour | null {
  const match = /^#([0-9a-f]{6})$/i.exec(hex.trim());
  if (match === null) return null;
  const value = parseInt(match[1], 16);
  return { r: (value >> 16) & 255, g: (value >> 8) & 255, b: value & 255 };
}
