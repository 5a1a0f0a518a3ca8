import type { ChartWindow } from './chart-window';
import { quantile } from './quantile';
import { type InkColour, isColourImage, type RawImage } from './raw-image';

/**
 * A linear ink score per pixel: score = offset − (wr·r + wg·g + wb·b) (grey images: offset − wr·grey).
 * About 1 on full ink, about 0 on bare paper and on the printed grid, so that a threshold separates ink.
 * Colour scans: the ink direction with the grid's colour direction projected out, so grid lines and
 * brownish stains score near 0 however dark they are. Grey scans: darkness beyond the grid's darkness.
 */
export interface InkContrast {
  mode: 'colour' | 'grey';
  offset: number;
  wr: number;
  wg: number;
  wb: number;
  /** Score at which a pixel counts as ink, for run finding. */
  threshold: number;
  paper: InkColour;
  /** Standard deviation of the score on bare paper (noise). */
  noiseScore: number;
}

export interface InkContrastOptions {
  /** Ink colour sampled by a click or given in chart.json. */
  inkColour?: InkColour;
  /** A pixel on the pen line: its neighbourhood gives the ink colour. */
  seed?: { xPx: number; yPx: number };
}

const MAX_SAMPLES = 20_000;
// Colour ink needs at least this share of its contrast left after removing the grid direction.
const MIN_ORTHOGONAL_SHARE = 0.3;
const MIN_THRESHOLD = 0.14;

interface Samples {
  r: Float32Array;
  g: Float32Array;
  b: Float32Array;
  /** Difference to the pixel two columns right, per channel (for the noise estimate). */
  nr: Float32Array;
  ng: Float32Array;
  nb: Float32Array;
  count: number;
}

function collectSamples(image: RawImage, window: ChartWindow): Samples {
  let area = 0;
  for (let i = 0; i < window.rowTop.length; i++) area += Math.max(0, window.rowBottom[i] - window.rowTop[i]);
  const step = Math.max(1, Math.floor(Math.sqrt(area / MAX_SAMPLES)));
  const capacity = Math.ceil(area / (step * step)) + window.rowTop.length + 16;
  const r = new Float32Array(capacity);
  const g = new Float32Array(capacity);
  const b = new Float32Array(capacity);
  const nr = new Float32Array(capacity);
  const ng = new Float32Array(capacity);
  const nb = new Float32Array(capacity);
  const { data, width, channels } = image;
  const colour = isColourImage(image);
  let count = 0;
  // Offset odd columns by half a step so that a sampling lattice cannot line up with the grid.
  for (let i = 0; i < window.rowTop.length && count < capacity; i += step) {
    const x = window.x0 + i;
    const start = window.rowTop[i] + ((i / step) % 2 === 1 ? step >> 1 : 0);
    for (let y = start; y < window.rowBottom[i] && count < capacity; y += step) {
      const k = (y * width + x) * channels;
      r[count] = data[k];
      g[count] = colour ? data[k + 1] : data[k];
      b[count] = colour ? data[k + 2] : data[k];
      const m = x + 2 < width ? k + 2 * channels : k;
      nr[count] = data[m] - data[k];
      ng[count] = colour ? data[m + 1] - data[k + 1] : nr[count];
      nb[count] = colour ? data[m + 2] - data[k + 2] : nr[count];
      count++;
    }
  }
  return { r, g, b, nr, ng, nb, count };
}

function median(values: Float32Array, count: number): number {
  return quantile(values, 0.5, count);
}

function sampleSeedColour(image: RawImage, seed: { xPx: number; yPx: number }): InkColour {
  // The darkest pixel near the click is the core of the pen line.
  const { data, width, height, channels } = image;
  const colour = isColourImage(image);
  let best = Infinity;
  let found: InkColour = { r: 0, g: 0, b: 0 };
  for (let y = Math.max(0, Math.floor(seed.yPx) - 4); y <= Math.min(height - 1, Math.floor(seed.yPx) + 4); y++) {
    for (let x = Math.max(0, Math.floor(seed.xPx) - 4); x <= Math.min(width - 1, Math.floor(seed.xPx) + 4); x++) {
      const k = (y * width + x) * channels;
      const r = data[k];
      const g = colour ? data[k + 1] : r;
      const b = colour ? data[k + 2] : r;
      if (r + g + b < best) {
        best = r + g + b;
        found = { r, g, b };
      }
    }
  }
  return found;
}

function normalise(v: [number, number, number]): [number, number, number] {
  const length = Math.hypot(v[0], v[1], v[2]);
  return length > 0 ? [v[0] / length, v[1] / length, v[2] / length] : [0, 0, 0];
}

function dot(a: readonly number[], b: readonly number[]): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

/** Estimates paper, grid and ink colours from the window and returns the ink score. */
export function estimateInkContrast(image: RawImage, window: ChartWindow, options: InkContrastOptions = {}): InkContrast {
  const samples = collectSamples(image, window);
  const n = samples.count;
  const paper: [number, number, number] = [median(samples.r, n), median(samples.g, n), median(samples.b, n)];
  const given = options.inkColour ?? (options.seed ? sampleSeedColour(image, options.seed) : undefined);

  // Differences from paper; "dark" samples are the printed grid, the ink and the stains.
  const dr = new Float32Array(n);
  const dg = new Float32Array(n);
  const db = new Float32Array(n);
  for (let i = 0; i < n; i++) {
    dr[i] = paper[0] - samples.r[i];
    dg[i] = paper[1] - samples.g[i];
    db[i] = paper[2] - samples.b[i];
  }
  const paperNoise = estimatePaperNoise(dr, dg, db, n);
  const darkLimit = Math.max(18, 6 * paperNoise);

  if (isColourImage(image)) {
    const colour = colourContrast(samples, dr, dg, db, n, darkLimit, paper, given);
    if (colour !== null) return colour;
  }
  return greyContrast(samples, dr, dg, db, n, darkLimit, paper, given);
}

function estimatePaperNoise(dr: Float32Array, dg: Float32Array, db: Float32Array, n: number): number {
  const deviations = new Float32Array(n);
  for (let i = 0; i < n; i++) deviations[i] = Math.abs(dr[i] + dg[i] + db[i]) / 3;
  // Median absolute deviation → standard deviation for normal noise (factor 1.4826, common practice).
  return 1.4826 * quantile(deviations, 0.5);
}

function colourContrast(
  samples: Samples,
  dr: Float32Array,
  dg: Float32Array,
  db: Float32Array,
  n: number,
  darkLimit: number,
  paper: [number, number, number],
  given: InkColour | undefined,
): InkContrast | null {
  // Grid direction: the mean colour shift of dark samples, refined once without the ink-like ones.
  let grid: [number, number, number] = [0, 0, 0];
  for (let pass = 0; pass < 2; pass++) {
    let sr = 0;
    let sg = 0;
    let sb = 0;
    for (let i = 0; i < n; i++) {
      const r = dr[i];
      const g = dg[i];
      const b = db[i];
      const length2 = r * r + g * g + b * b;
      if (length2 < darkLimit * darkLimit) continue;
      if (pass === 1) {
        const along = r * grid[0] + g * grid[1] + b * grid[2];
        if (length2 - along * along > 0.0625 * length2) continue;
      }
      sr += r;
      sg += g;
      sb += b;
    }
    grid = normalise([sr, sg, sb]);
  }
  let ink: [number, number, number];
  if (given) ink = [paper[0] - given.r, paper[1] - given.g, paper[2] - given.b];
  else {
    // No colour given: the samples least explained by the grid colour are ink.
    const residuals = new Float32Array(n);
    for (let i = 0; i < n; i++) {
      const r = dr[i];
      const g = dg[i];
      const b = db[i];
      const along = r * grid[0] + g * grid[1] + b * grid[2];
      residuals[i] = Math.sqrt(Math.max(0, r * r + g * g + b * b - along * along));
    }
    const limit = Math.max(darkLimit, quantile(residuals, 0.997));
    const sum: [number, number, number] = [0, 0, 0];
    for (let i = 0; i < n; i++) {
      if (residuals[i] < limit) continue;
      sum[0] += dr[i];
      sum[1] += dg[i];
      sum[2] += db[i];
    }
    ink = sum;
  }
  const along = dot(ink, grid);
  const orthogonal: [number, number, number] = [ink[0] - along * grid[0], ink[1] - along * grid[1], ink[2] - along * grid[2]];
  const inkLength = Math.hypot(ink[0], ink[1], ink[2]);
  const orthogonalLength = Math.hypot(orthogonal[0], orthogonal[1], orthogonal[2]);
  if (inkLength === 0 || orthogonalLength < MIN_ORTHOGONAL_SHARE * inkLength) return null;
  const direction = normalise(orthogonal);

  const scores = new Float32Array(n);
  // Noise from differences between near neighbours on bare paper: stains and uneven paper change slowly and
  // must not raise the threshold; grid edges are left out with the dark samples.
  const steps = new Float32Array(n);
  let stepCount = 0;
  for (let i = 0; i < n; i++) {
    scores[i] = dr[i] * direction[0] + dg[i] * direction[1] + db[i] * direction[2];
    if (dr[i] * dr[i] + dg[i] * dg[i] + db[i] * db[i] < darkLimit * darkLimit) {
      steps[stepCount++] = Math.abs(samples.nr[i] * direction[0] + samples.ng[i] * direction[1] + samples.nb[i] * direction[2]);
    }
  }
  const full = fullInkScore(scores, given ? dot(ink, direction) : 0);
  // Median |difference| of two independent normal values → σ: divide by 0.6745·√2 (common practice).
  const noiseScore = quantile(steps, 0.5, stepCount) / (0.6745 * Math.SQRT2) / full;
  return {
    mode: 'colour',
    offset: dot(paper, direction) / full,
    wr: direction[0] / full,
    wg: direction[1] / full,
    wb: direction[2] / full,
    threshold: Math.min(0.4, Math.max(MIN_THRESHOLD, 5 * noiseScore)),
    paper: { r: paper[0], g: paper[1], b: paper[2] },
    noiseScore,
  };
}

/** Score of "full" ink: the strongest few per mille of samples (the pen line's core), not below half the nominal. */
function fullInkScore(scores: Float32Array, nominal: number): number {
  const top = quantile(scores, 0.998);
  return Math.max(top, 0.5 * nominal, 1e-6);
}

function greyContrast(
  samples: Samples,
  dr: Float32Array,
  dg: Float32Array,
  db: Float32Array,
  n: number,
  darkLimit: number,
  paper: [number, number, number],
  given: InkColour | undefined,
): InkContrast {
  // Luma weights (ITU-R BT.601, common practice) so that colour scans falling back here behave like grey ones.
  const lr = 0.299;
  const lg = 0.587;
  const lb = 0.114;
  const darkness = new Float32Array(n);
  let darkCount = 0;
  for (let i = 0; i < n; i++) darkness[i] = lr * dr[i] + lg * dg[i] + lb * db[i];
  const dark = new Float32Array(n);
  for (let i = 0; i < n; i++) if (darkness[i] > darkLimit) dark[darkCount++] = darkness[i];
  const inkDarkness = given
    ? Math.max(lr * (paper[0] - given.r) + lg * (paper[1] - given.g) + lb * (paper[2] - given.b), quantile(darkness, 0.998) * 0.5)
    : quantile(darkness, 0.998);
  // The heavy printed lines are the darkest common non-ink pixels: ink must be darker than them.
  const gridDarkness = darkCount > 0 ? Math.min(quantile(dark.slice(0, darkCount), 0.9), 0.6 * inkDarkness) : darkLimit;
  const span = Math.max(1e-6, inkDarkness - gridDarkness);
  const steps = new Float32Array(n);
  let stepCount = 0;
  for (let i = 0; i < n; i++) {
    if (Math.abs(darkness[i]) < darkLimit) steps[stepCount++] = Math.abs(lr * samples.nr[i] + lg * samples.ng[i] + lb * samples.nb[i]);
  }
  const noiseScore = quantile(steps, 0.5, stepCount) / (0.6745 * Math.SQRT2) / span;
  const paperLuma = lr * paper[0] + lg * paper[1] + lb * paper[2];
  return {
    mode: 'grey',
    offset: (paperLuma - gridDarkness) / span,
    wr: lr / span,
    wg: lg / span,
    wb: lb / span,
    threshold: Math.min(0.4, Math.max(MIN_THRESHOLD, 5 * noiseScore)),
    paper: { r: paper[0], g: paper[1], b: paper[2] },
    noiseScore,
  };
}
