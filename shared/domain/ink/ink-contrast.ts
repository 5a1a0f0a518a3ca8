import type { ChartWindow } from './chart-window';
import { createLabLut, type LabLut, readLut, rescaleLut } from './lab-contrast';
import { quantile } from './quantile';
import { type InkColour, isColourImage, type RawImage } from './raw-image';

/**
 * A linear ink score per pixel: score = offset − (wr·r + wg·g + wb·b) (grey images: offset − wr·grey).
 * About 1 on full ink, about 0 on bare paper and on the printed grid, so that a threshold separates ink.
 * Colour scans: the ink direction with the grid's colour direction projected out, so grid lines and
 * brownish stains score near 0 however dark they are. Grey scans: darkness beyond the grid's darkness.
 */
export type InkModel = 'colour' | 'lab' | 'grey';

export interface InkContrast {
  /**
   * colour: the grid's colour direction projected out (ink far from the grid in hue); lab: nearer ink than grid and
   * paper in CIELAB (ink close in colour to the grid); grey: darker than the grid (grey scans, or no usable colour).
   */
  mode: InkModel;
  /** Why this model was taken, in words for the trace. */
  reason: string;
  offset: number;
  wr: number;
  wg: number;
  wb: number;
  /** Score at which a pixel counts as ink, for run finding. */
  threshold: number;
  paper: InkColour;
  /** Standard deviation of the score on bare paper (noise). */
  noiseScore: number;
  /** The lab model's score per colour, used instead of the linear weights (absent for the linear models). */
  lut?: LabLut;
}

export interface InkContrastOptions {
  /** Ink colour sampled by a click or given in chart.json. */
  inkColour?: InkColour;
  /** A pixel on the pen line: its neighbourhood gives the ink colour. */
  seed?: { xPx: number; yPx: number };
}

const MAX_SAMPLES = 20_000;
// Ink with at least this share of its contrast left after removing the grid direction is scored linearly (colour);
// closer to the grid's colour it is scored in CIELAB (lab).
const LINEAR_ORTHOGONAL_SHARE = 0.5;
// Between the two shares the CIELAB model is taken when it lets through less than this share of what the linear one does.
const LAB_LEAKAGE_SHARE = 1 / 3;
// Below this share the linear model is not tried at all (it would amplify noise more than it removes the grid).
const MIN_LINEAR_SHARE = 0.3;
// Ink and full grid closer than this (ΔE-like, RGB units) cannot be told apart by colour: darker than the grid.
const MIN_INK_GRID_DISTANCE = 12;
// Grey levels of channel spread below which a colour scan is taken as grey.
const MIN_HUE_LEVELS = 6;
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
  return greyContrast(samples, dr, dg, db, n, darkLimit, paper, given, !isColourImage(image));
}

/** Mean shift from paper of the samples picked. */
function meanShift(dr: Float32Array, dg: Float32Array, db: Float32Array, n: number, pick: (i: number) => boolean): [number, number, number] {
  const sum: [number, number, number] = [0, 0, 0];
  let count = 0;
  for (let i = 0; i < n; i++) {
    if (!pick(i)) continue;
    sum[0] += dr[i];
    sum[1] += dg[i];
    sum[2] += db[i];
    count++;
  }
  return count > 0 ? [sum[0] / count, sum[1] / count, sum[2] / count] : sum;
}

/** The printed grid's full colour: along its colour direction, as far as the strongest tenth of grid-like samples. */
function fullGridColour(
  dr: Float32Array,
  dg: Float32Array,
  db: Float32Array,
  n: number,
  darkLimit: number,
  grid: [number, number, number],
  paper: [number, number, number],
): [number, number, number] {
  const along = new Float32Array(n);
  let count = 0;
  for (let i = 0; i < n; i++) {
    const length2 = dr[i] * dr[i] + dg[i] * dg[i] + db[i] * db[i];
    if (length2 < darkLimit * darkLimit) continue;
    const a = dr[i] * grid[0] + dg[i] * grid[1] + db[i] * grid[2];
    if (length2 - a * a > 0.0625 * length2) continue;
    along[count++] = a;
  }
  const depth = count > 0 ? quantile(along, 0.9, count) : darkLimit;
  return [paper[0] - depth * grid[0], paper[1] - depth * grid[1], paper[2] - depth * grid[2]];
}

/** The CIELAB model (see lab-contrast.ts): scores normalised so the pen line's core scores about 1. */
function labContrast(
  samples: Samples,
  dr: Float32Array,
  dg: Float32Array,
  db: Float32Array,
  n: number,
  darkLimit: number,
  paper: [number, number, number],
  grid: [number, number, number],
  ink: [number, number, number],
  isGiven: boolean,
  share: number,
  source: string,
): InkContrast {
  const lut = createLabLut({ paper, grid, ink });
  const scores = new Float32Array(n);
  const paperScores = new Float32Array(n);
  let paperCount = 0;
  for (let i = 0; i < n; i++) {
    scores[i] = readLut(lut, samples.r[i], samples.g[i], samples.b[i]);
    if (dr[i] * dr[i] + dg[i] * dg[i] + db[i] * db[i] < darkLimit * darkLimit) paperScores[paperCount++] = scores[i];
  }
  const full = fullInkScore(scores, isGiven ? 1 : 0);
  rescaleLut(lut, 1 / full);
  // The score is clamped at 0, so the spread on bare paper is read from its upper side: the 84th percentile is
  // about one standard deviation above the middle for normal noise (common practice).
  const noiseScore = paperCount > 0 ? Math.max(0, quantile(paperScores, 0.84, paperCount) - quantile(paperScores, 0.5, paperCount)) / full : 0;
  const hex = (c: readonly number[]) => `#${c.map((v) => Math.round(Math.min(255, Math.max(0, v))).toString(16).padStart(2, '0')).join('')}`;
  return {
    mode: 'lab',
    reason:
      `colour scan; ${source} (${hex(ink)}) keeps only ${Math.round(100 * share)} % of its contrast across the grid's colour (${hex(grid)}), ` +
      'so each pixel is scored in CIELAB by how much nearer it is to the ink than to the grid and the paper',
    offset: 0,
    wr: 0,
    wg: 0,
    wb: 0,
    threshold: Math.min(0.4, Math.max(MIN_THRESHOLD, 5 * noiseScore)),
    paper: { r: paper[0], g: paper[1], b: paper[2] },
    noiseScore,
    lut,
  };
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
  // A grey scan stored as RGB has no hue to tell ink from grid: darker than the grid is all there is. What counts is
  // the hue on the scan (its grid and its darkest pixels), not the colour given for the pen: a grey scan of a blue
  // line is still grey.
  const gridColour = fullGridColour(dr, dg, db, n, darkLimit, grid, paper);
  const darkness = new Float32Array(n);
  for (let i = 0; i < n; i++) darkness[i] = dr[i] + dg[i] + db[i];
  const darkestLimit = quantile(darkness, 0.997);
  const darkest = meanShift(dr, dg, db, n, (i) => darkness[i] >= darkestLimit);
  const hueOf = (c: readonly number[]) => Math.max(c[0], c[1], c[2]) - Math.min(c[0], c[1], c[2]);
  const paperHue = hueOf(paper);
  const darkestColour = [paper[0] - darkest[0], paper[1] - darkest[1], paper[2] - darkest[2]];
  if (Math.max(Math.abs(hueOf(darkestColour) - paperHue), Math.abs(hueOf(gridColour) - paperHue)) < MIN_HUE_LEVELS) return null;
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
    ink = meanShift(dr, dg, db, n, (i) => residuals[i] >= limit);
  }
  const along = dot(ink, grid);
  const orthogonal: [number, number, number] = [ink[0] - along * grid[0], ink[1] - along * grid[1], ink[2] - along * grid[2]];
  const inkLength = Math.hypot(ink[0], ink[1], ink[2]);
  const orthogonalLength = Math.hypot(orthogonal[0], orthogonal[1], orthogonal[2]);
  const share = inkLength > 0 ? orthogonalLength / inkLength : 0;
  const source = given ? 'the given ink colour' : 'the ink colour found on the scan';
  const closeInHue = share < LINEAR_ORTHOGONAL_SHARE;
  const linear = closeInHue && share < MIN_LINEAR_SHARE ? null : linearColourContrast(samples, dr, dg, db, n, darkLimit, paper, ink, orthogonal, given, share, source);
  if (!closeInHue) return linear;
  // Close in hue to the grid. Without a given colour the least grid-like samples may be stains or noise; the
  // darkest few are more likely the pen's core.
  const labInk = given ? ink : darkest;
  const inkColour: [number, number, number] = [paper[0] - labInk[0], paper[1] - labInk[1], paper[2] - labInk[2]];
  const distance = Math.hypot(inkColour[0] - gridColour[0], inkColour[1] - gridColour[1], inkColour[2] - gridColour[2]);
  if (distance < MIN_INK_GRID_DISTANCE) return linear;
  const lab = labContrast(samples, dr, dg, db, n, darkLimit, paper, gridColour, inkColour, given !== undefined, share, source);
  if (linear === null) return lab;
  // Both could work. The linear model is the proven one; the CIELAB model takes over when it lets clearly fewer of
  // the printed grid's and the stains' pixels through as ink.
  const linearLeak = leakage(samples, dr, dg, db, n, darkLimit, linear);
  const labLeak = leakage(samples, dr, dg, db, n, darkLimit, lab);
  const chosen = labLeak < LAB_LEAKAGE_SHARE * linearLeak ? lab : linear;
  return {
    ...chosen,
    reason: `${chosen.reason}; of the non-paper samples the CIELAB model lets ${(100 * labLeak).toFixed(1)} % through as ink, the linear one ${(100 * linearLeak).toFixed(1)} %`,
  };
}

/**
 * Share of the dark (non-paper) samples that score as ink. The pen line is a small part of them; the printed grid,
 * labels and stains are most of it, so a model that lets fewer through tells ink from grid better.
 */
function leakage(samples: Samples, dr: Float32Array, dg: Float32Array, db: Float32Array, n: number, darkLimit: number, contrast: InkContrast): number {
  let dark = 0;
  let inked = 0;
  for (let i = 0; i < n; i++) {
    if (dr[i] * dr[i] + dg[i] * dg[i] + db[i] * db[i] < darkLimit * darkLimit) continue;
    dark++;
    const r = samples.r[i];
    const g = samples.g[i];
    const b = samples.b[i];
    const score = contrast.lut ? readLut(contrast.lut, r, g, b) : contrast.offset - (contrast.wr * r + contrast.wg * g + contrast.wb * b);
    if (score >= contrast.threshold) inked++;
  }
  return dark > 0 ? inked / dark : 0;
}

/** The linear model: the ink's shift from paper with the grid's colour direction projected out. */
function linearColourContrast(
  samples: Samples,
  dr: Float32Array,
  dg: Float32Array,
  db: Float32Array,
  n: number,
  darkLimit: number,
  paper: [number, number, number],
  ink: [number, number, number],
  orthogonal: [number, number, number],
  given: InkColour | undefined,
  share: number,
  source: string,
): InkContrast {
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
    reason: `colour scan; ${source} keeps ${Math.round(100 * share)} % of its contrast across the grid's colour, so the grid's colour is projected out`,
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
  isGreyImage: boolean,
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
    reason: isGreyImage
      ? 'grey-scale scan: ink is told from the grid by being darker than it'
      : "colour scan, but the ink cannot be told from the grid by colour: ink is told from the grid by being darker than it",
    offset: (paperLuma - gridDarkness) / span,
    wr: lr / span,
    wg: lg / span,
    wb: lb / span,
    threshold: Math.min(0.4, Math.max(MIN_THRESHOLD, 5 * noiseScore)),
    paper: { r: paper[0], g: paper[1], b: paper[2] },
    noiseScore,
  };
}
