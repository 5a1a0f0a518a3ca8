import type { RawImage } from './ink/raw-image';

/** A printed crossing found in the image near a click, continuous pixel coordinates (pixel i covers [i, i + 1)). */
export interface SnappedCrossing {
  x: number;
  y: number;
  /** How far the crossing is from the click, px. */
  distancePx: number;
}

/** Options of snapToCrossing. */
export interface SnapOptions {
  /** Half the side of the searched square, px: a crossing farther than this from the click is not taken. */
  radiusPx: number;
  /**
   * How far a line's darkness must stand above the square's median, as a share of the darkest column or row's
   * rise; below it there is no printed line (default 0.35).
   */
  minProminence?: number;
}

// A printed grid line is a few grey levels darker than its paper even when faint; below this rise (0–255 a
// pixel, summed over the window) there is no line, only paper grain and scanner noise (common practice).
const MIN_RISE_PER_PIXEL = 6;

/**
 * Snaps a click to the printed grid crossing nearest it: in the square of ±radiusPx about the click, the
 * column and row darkness profiles (the time line and the pressure line, near enough straight over a few
 * pixels) each give the peak nearest the click, refined to a fraction of a pixel by a parabola through the
 * peak and its two neighbours. Null when either line is not there (too faint, or no peak inside the square).
 */
export function snapToCrossing(image: RawImage, click: { x: number; y: number }, options: SnapOptions): SnappedCrossing | null {
  const radius = Math.max(2, Math.round(options.radiusPx));
  const first = findCrossing(image, click, radius, options.minProminence ?? 0.35);
  // A time arc leans a little away from the pivot's level, so a window centred off the crossing reads its x a
  // little off; a second look centred on the first answer reads both lines where they cross.
  const found = first === null ? null : findCrossing(image, first, radius, options.minProminence ?? 0.35);
  if (found === null) return null;
  const distancePx = Math.hypot(found.x - click.x, found.y - click.y);
  return distancePx <= radius * Math.SQRT2 ? { ...found, distancePx } : null;
}

function findCrossing(image: RawImage, near: { x: number; y: number }, radius: number, minProminence: number): { x: number; y: number } | null {
  const left = Math.max(0, Math.floor(near.x) - radius);
  const right = Math.min(image.width - 1, Math.floor(near.x) + radius);
  const top = Math.max(0, Math.floor(near.y) - radius);
  const bottom = Math.min(image.height - 1, Math.floor(near.y) + radius);
  if (right - left < 2 || bottom - top < 2) return null;

  const columns = new Float64Array(right - left + 1);
  const rows = new Float64Array(bottom - top + 1);
  for (let y = top; y <= bottom; y++) {
    for (let x = left; x <= right; x++) {
      const darkness = 255 - brightness(image, x, y);
      columns[x - left] += darkness;
      rows[y - top] += darkness;
    }
  }
  const x = nearestPeak(columns, near.x - left - 0.5, minProminence, MIN_RISE_PER_PIXEL * rows.length);
  const y = nearestPeak(rows, near.y - top - 0.5, minProminence, MIN_RISE_PER_PIXEL * columns.length);
  return x === null || y === null ? null : { x: left + x + 0.5, y: top + y + 0.5 };
}

/** Mean of the colour channels (alpha ignored), 0–255. */
function brightness(image: RawImage, x: number, y: number): number {
  const at = (y * image.width + x) * image.channels;
  if (image.channels < 3) return image.data[at];
  return (image.data[at] + image.data[at + 1] + image.data[at + 2]) / 3;
}

/**
 * The sub-pixel position (index units) of the profile's local maximum nearest `target` whose rise above the
 * profile's median is at least `minProminence` of the highest rise and at least `minRise`; null when none.
 */
function nearestPeak(profile: Float64Array, target: number, minProminence: number, minRise: number): number | null {
  const median = [...profile].sort((a, b) => a - b)[Math.floor(profile.length / 2)];
  const highest = Math.max(...profile) - median;
  if (highest < minRise) return null;
  let best: number | null = null;
  for (let i = 1; i < profile.length - 1; i++) {
    const isPeak = profile[i] >= profile[i - 1] && profile[i] > profile[i + 1];
    if (!isPeak || profile[i] - median < minProminence * highest) continue;
    const position = i + vertexOffset(profile[i - 1] - median, profile[i] - median, profile[i + 1] - median);
    if (best === null || Math.abs(position - target) < Math.abs(best - target)) best = position;
  }
  return best;
}

/**
 * Offset (−0.5…0.5) of the peak from the middle of three samples. A printed line's cross-profile is close to a
 * Gaussian (ink spread by the paper and the scanner's optics), so the parabola goes through the logarithms of
 * the rises, which is exact for a Gaussian; a plain parabola where a rise is not positive.
 */
function vertexOffset(before: number, middle: number, after: number): number {
  const [a, b, c] = before > 0 && middle > 0 && after > 0 ? [Math.log(before), Math.log(middle), Math.log(after)] : [before, middle, after];
  const curvature = a - 2 * b + c;
  if (!(curvature < 0)) return 0;
  return Math.max(-0.5, Math.min(0.5, (0.5 * (a - c)) / curvature));
}
