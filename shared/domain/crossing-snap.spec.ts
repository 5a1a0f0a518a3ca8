import { snapToCrossing } from './crossing-snap';
import type { RawImage } from './ink/raw-image';

/**
 * An invented grey scan: paper at 240, printed lines 1.6 px wide (Gaussian across, peak 110 levels darker)
 * centred at the given continuous x (time lines) and y (pressure lines); pixel i's centre is i + 0.5.
 */
function gridImage(lineXs: number[], lineYs: number[], width = 60, height = 50, depth = 110, leanPerRow = 0): RawImage {
  const data = new Uint8Array(width * height);
  const sigma = 0.8;
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const near = (centres: number[], at: number) => Math.max(0, ...centres.map((c) => Math.exp(-((at + 0.5 - c) ** 2) / (2 * sigma * sigma))));
      // A leaning time line (an arc away from the pivot level) moves leanPerRow px sideways a row, about its crossing row.
      const ink = Math.max(near(lineXs.map((c) => c + leanPerRow * (y + 0.5 - (lineYs[0] ?? 0))), x), near(lineYs, y));
      data[y * width + x] = Math.round(240 - depth * ink);
    }
  }
  return { data, width, height, channels: 1 };
}

describe('snapToCrossing', () => {
  it('when a click lands 2 px off a printed crossing, then it snaps to the crossing within a tenth of a pixel', () => {
    const image = gridImage([20.3], [15.7]);

    const snapped = snapToCrossing(image, { x: 22.1, y: 14.2 }, { radiusPx: 5 });

    expect(Math.abs(snapped!.x - 20.3)).toBeLessThan(0.1);
    expect(Math.abs(snapped!.y - 15.7)).toBeLessThan(0.1);
    expect(snapped?.distancePx).toBeCloseTo(Math.hypot(1.8, 1.5), 1);
  });

  it('when two grid lines run inside the window, then the one nearest the click is taken', () => {
    // Lines 5.3 px apart (a 1 hPa grid at 150 dpi, 0.9 mm a hPa); the click is nearer the second.
    const image = gridImage([20.3, 25.6], [15.7, 21.0]);

    const snapped = snapToCrossing(image, { x: 24.4, y: 20.1 }, { radiusPx: 6 });

    expect(snapped?.x).toBeCloseTo(25.6, 1);
    expect(snapped?.y).toBeCloseTo(21.0, 1);
  });

  it('when the time line leans and the click is off the crossing row, then the crossing is still found where the lines cross', () => {
    // A lean of 0.15 px a row: a 150 mm arm 22 mm from the pivot level (docs/references.md §6); a one-look window 4 rows off reads x 0.7 px out.
    const image = gridImage([30.2], [25.4], 60, 50, 110, 0.15);

    const snapped = snapToCrossing(image, { x: 31.5, y: 21.4 }, { radiusPx: 6 });

    expect(Math.abs(snapped!.x - 30.2)).toBeLessThan(0.15);
    expect(Math.abs(snapped!.y - 25.4)).toBeLessThan(0.15);
  });

  it('when only one line passes near the click, then there is no crossing to snap to', () => {
    const image = gridImage([20.3], []);

    expect(snapToCrossing(image, { x: 21, y: 20 }, { radiusPx: 5 })).toBeNull();
  });

  it('when the paper is blank but for noise, then nothing is snapped', () => {
    const image = gridImage([], []);
    image.data.forEach((_, i) => (image.data[i] = 240 - ((i * 7919) % 5)));

    expect(snapToCrossing(image, { x: 30, y: 25 }, { radiusPx: 6 })).toBeNull();
  });

  it('when the click is at the edge of the image, then the window is cut to the image and still finds the crossing', () => {
    const image = gridImage([2.4], [2.6]);

    const snapped = snapToCrossing(image, { x: 1.2, y: 1.1 }, { radiusPx: 5 });

    expect(snapped?.x).toBeCloseTo(2.4, 1);
    expect(snapped?.y).toBeCloseTo(2.6, 1);
  });
});
