import type { ChartForm } from '../chart-form';
import { fitRegistration, type RegistrationFit } from '../registration';
import type { RawImage } from './raw-image';

/**
 * Small hand-made scans for the ink specs: a straight-line chart form (no arcs), a known pixel mapping,
 * and painters for grid lines and pen strokes with anti-aliased edges. Pure TypeScript, no image library.
 */
export const SYNTHETIC_FORM: ChartForm = {
  name: 'synthetic 24 h',
  pressureUnit: 'hPa',
  pressureMin: 980,
  pressureMax: 1020,
  drumHours: 24,
  mmPerHour: 10,
  mmPerUnit: 2,
  penArmRadiusMm: null,
  pivotPressure: null,
  arcSide: 1,
  gridPressureStep: 1,
  labelPressureStep: 10,
  gridHoursStep: 1,
  labelHoursStep: 6,
};

/** 4 px per mm: 240 mm × 80 mm of chart inside a 20 px margin. */
export const PX_PER_MM = 4;
export const MARGIN_PX = 20;
export const PAPER = [243, 236, 220] as const;
export const GRID = [217, 154, 91] as const;
export const INK = [59, 44, 134] as const;

export function pixelOf(hours: number, pressure: number): { xPx: number; yPx: number } {
  const form = SYNTHETIC_FORM;
  return {
    xPx: MARGIN_PX + hours * form.mmPerHour * PX_PER_MM,
    yPx: MARGIN_PX + (form.pressureMax - pressure) * form.mmPerUnit * PX_PER_MM,
  };
}

export function syntheticFit(): RegistrationFit {
  const corners = [
    { hours: 0, pressure: 1020 },
    { hours: 24, pressure: 1020 },
    { hours: 24, pressure: 980 },
    { hours: 0, pressure: 980 },
  ];
  return fitRegistration(
    SYNTHETIC_FORM,
    corners.map((c) => ({ ...pixelOf(c.hours, c.pressure), ...c })),
  );
}

/** A blank sheet of paper with the printed grid (pressure lines every unit, hour lines), in the grid colour given. */
export function blankScan(channels: 1 | 3 = 3, grid: readonly number[] = GRID): RawImage {
  const width = 2 * MARGIN_PX + 24 * 10 * PX_PER_MM;
  const height = 2 * MARGIN_PX + 40 * 2 * PX_PER_MM;
  const image: RawImage = { data: new Uint8Array(width * height * channels), width, height, channels };
  for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) paint(image, x, y, PAPER, 1);
  for (let p = 980; p <= 1020; p++) {
    const y = pixelOf(0, p).yPx;
    const heavy = p % 10 === 0;
    for (let x = MARGIN_PX; x < width - MARGIN_PX; x++) paint(image, x, Math.floor(y), grid, heavy ? 1 : 0.7);
  }
  for (let h = 0; h <= 24; h++) {
    const x = Math.floor(pixelOf(h, 1000).xPx);
    for (let y = MARGIN_PX; y < height - MARGIN_PX; y++) paint(image, x, y, grid, 0.7);
  }
  return image;
}

/** Blends a colour into one pixel with the given coverage (0–1); grey images take its luma. */
export function paint(image: RawImage, x: number, y: number, colour: readonly number[], coverage: number): void {
  if (x < 0 || y < 0 || x >= image.width || y >= image.height || coverage <= 0) return;
  const k = (y * image.width + x) * image.channels;
  const c = Math.min(1, coverage);
  if (image.channels === 1) {
    const luma = 0.299 * colour[0] + 0.587 * colour[1] + 0.114 * colour[2];
    image.data[k] = Math.round(image.data[k] * (1 - c) + luma * c);
    return;
  }
  for (let ch = 0; ch < 3; ch++) image.data[k + ch] = Math.round(image.data[k + ch] * (1 - c) + colour[ch] * c);
}

/**
 * Draws a pen stroke y = f(x) for x in [x0, x1] (pixels), widthPx wide, measured across the stroke.
 * Coverage falls off linearly over one pixel at the edges.
 */
export function drawStroke(image: RawImage, f: (x: number) => number, x0: number, x1: number, widthPx: number, colour: readonly number[] = INK): void {
  for (let x = Math.floor(x0); x < Math.ceil(x1); x++) {
    const cx = x + 0.5;
    const slope = (f(cx + 0.5) - f(cx - 0.5));
    const halfSpan = (widthPx / 2) * Math.sqrt(1 + slope * slope) + Math.abs(slope) / 2;
    const centre = f(cx);
    for (let y = Math.floor(centre - halfSpan - 1); y <= Math.ceil(centre + halfSpan + 1); y++) {
      const distance = Math.abs(y + 0.5 - centre);
      paint(image, x, y, colour, halfSpan + 0.5 - distance);
    }
  }
}

/** Draws a vertical stroke (a time mark, or the pen moving straight up) from y0 to y1 at column x. */
export function drawVertical(image: RawImage, xCentre: number, y0: number, y1: number, widthPx: number, colour: readonly number[] = INK): void {
  for (let y = Math.floor(Math.min(y0, y1)); y <= Math.ceil(Math.max(y0, y1)); y++) {
    for (let x = Math.floor(xCentre - widthPx); x <= Math.ceil(xCentre + widthPx); x++) {
      paint(image, x, y, colour, widthPx / 2 + 0.5 - Math.abs(x + 0.5 - xCentre));
    }
  }
}
