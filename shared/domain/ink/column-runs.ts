import type { ChartWindow } from './chart-window';
import type { InkContrast } from './ink-contrast';
import { type LabLut, readLut } from './lab-contrast';
import { slidingMax as slidingMaxOf } from './local-strength';
import type { RawImage } from './raw-image';

/**
 * Per sampled image column, the runs of ink-scoring pixels found down that column: the candidates the path
 * search picks from. Flat typed arrays, `slots` entries per column; entry k of column i is at i·slots + k.
 * Column i is the time column (see ChartWindow) at pixel x0 + i·step on the pivot row.
 */
export interface ColumnRuns {
  x0: number;
  step: number;
  columns: number;
  slots: number;
  count: Uint8Array;
  /** First row of the run and the row after its last (pixel edges, continuous coordinates). */
  top: Float32Array;
  bottom: Float32Array;
  /** Score-weighted centre, continuous coordinates. */
  centre: Float32Array;
  /** Sum (per sampled row, scaled by the row step) and peak of the score over the run. */
  mass: Float32Array;
  peak: Float32Array;
}

/** Candidate runs kept per column; the rest (weakest first) are dropped. */
export const RUN_SLOTS = 8;

function emptyRuns(x0: number, step: number, columns: number): ColumnRuns {
  const n = columns * RUN_SLOTS;
  return {
    x0,
    step,
    columns,
    slots: RUN_SLOTS,
    count: new Uint8Array(columns),
    top: new Float32Array(n),
    bottom: new Float32Array(n),
    centre: new Float32Array(n),
    mass: new Float32Array(n),
    peak: new Float32Array(n),
  };
}

/** Rank of a run for the slot list: half its mean over at least one line width, half its peak. */
function rankOf(mass: number, length: number, peak: number, widthPx: number): number {
  return 0.5 * (mass / Math.max(length, widthPx)) + 0.5 * peak;
}

/** Stores a finished run in column i, replacing the weakest run when the column is full. */
function keepRun(runs: ColumnRuns, i: number, top: number, bottom: number, mass: number, moment: number, peak: number, widthPx: number): void {
  const base = i * runs.slots;
  let k = runs.count[i];
  if (k === runs.slots) {
    let weakest = 0;
    let weakestRank = Infinity;
    for (let s = 0; s < runs.slots; s++) {
      const r = rankOf(runs.mass[base + s], runs.bottom[base + s] - runs.top[base + s], runs.peak[base + s], widthPx);
      if (r < weakestRank) {
        weakestRank = r;
        weakest = s;
      }
    }
    if (weakestRank >= rankOf(mass, bottom - top, peak, widthPx)) return;
    k = weakest;
  } else runs.count[i] = k + 1;
  runs.top[base + k] = top;
  runs.bottom[base + k] = bottom;
  runs.centre[base + k] = mass > 0 ? moment / mass : (top + bottom) / 2;
  runs.mass[base + k] = mass;
  runs.peak[base + k] = peak;
}

/**
 * Coarse pass: every `columnStep`-th column and `rowStep`-th row of the whole window, raw score, scanned row
 * by row (cache-friendly for interleaved pixels). Finds where the line is, not its exact centre.
 */
export function findCoarseRuns(
  image: RawImage,
  window: ChartWindow,
  contrast: InkContrast,
  columnStep: number,
  rowStep: number,
  widthPx: number,
): ColumnRuns {
  const columns = Math.max(0, Math.ceil((window.x1 - window.x0) / columnStep));
  const runs = emptyRuns(window.x0, columnStep, columns);
  if (columns === 0) return runs;
  const top = new Int32Array(columns);
  const bottom = new Int32Array(columns);
  let yMin = image.height;
  let yMax = 0;
  for (let i = 0; i < columns; i++) {
    top[i] = window.rowTop[i * columnStep];
    bottom[i] = window.rowBottom[i * columnStep];
    yMin = Math.min(yMin, top[i]);
    yMax = Math.max(yMax, bottom[i]);
  }
  const { data, width, channels } = image;
  const { offset, threshold } = contrast;
  const isColour = channels >= 3;
  const wr = isColour ? contrast.wr : contrast.wr + contrast.wg + contrast.wb;
  const { wg, wb, lut } = contrast;
  const runStart = new Int32Array(columns).fill(-1);
  const runMass = new Float64Array(columns);
  const runMoment = new Float64Array(columns);
  const runPeak = new Float32Array(columns);
  const pixelStep = columnStep * channels;
  for (let y = yMin; y < yMax; y += rowStep) {
    const centreY = y + 0.5;
    // This row of every time column, read along the arcs: one shift for the whole row.
    const xStart = window.x0 + Math.round(window.rowShift[y]);
    let k = (y * width + xStart) * channels;
    for (let i = 0, x = xStart; i < columns; i++, k += pixelStep, x += columnStep) {
      const inside = y >= top[i] && y < bottom[i] && x >= 0 && x < width;
      const s = !inside
        ? -1
        : !isColour
          ? offset - wr * data[k]
          : lut
            ? readLut(lut, data[k], data[k + 1], data[k + 2])
            : offset - (wr * data[k] + wg * data[k + 1] + wb * data[k + 2]);
      if (s >= threshold) {
        if (runStart[i] < 0) {
          runStart[i] = y;
          runMass[i] = 0;
          runMoment[i] = 0;
          runPeak[i] = 0;
        }
        runMass[i] += s * rowStep;
        runMoment[i] += s * rowStep * centreY;
        if (s > runPeak[i]) runPeak[i] = s;
      } else if (runStart[i] >= 0) {
        keepRun(runs, i, runStart[i], y, runMass[i], runMoment[i], runPeak[i], widthPx);
        runStart[i] = -1;
      }
    }
  }
  for (let i = 0; i < columns; i++) {
    if (runStart[i] >= 0) keepRun(runs, i, runStart[i], Math.min(yMax, bottom[i]), runMass[i], runMoment[i], runPeak[i], widthPx);
  }
  return runs;
}

/**
 * Fine pass: every column, only the rows of its band (where the coarse path says the line is), score smoothed
 * with a 3×3 binomial kernel (tames sensor noise and JPEG blocks without moving a symmetric line's centre).
 * Scanned column by column; a band is a few dozen rows, so its pixels stay in cache between neighbours.
 */
export function findBandRuns(
  image: RawImage,
  window: ChartWindow,
  bandTop: Int32Array,
  bandBottom: Int32Array,
  contrast: InkContrast,
  widthPx: number,
): ColumnRuns {
  const columns = bandTop.length;
  const x0 = window.x0;
  const shift = window.rowShift;
  const runs = emptyRuns(x0, 1, columns);
  const { data, width, height, channels } = image;
  const { offset, threshold } = contrast;
  const isColour = channels >= 3;
  const wr = isColour ? contrast.wr : contrast.wr + contrast.wg + contrast.wb;
  const { wg, wb, lut } = contrast;
  let horizontal = new Float32Array(0);
  const flat = lut ? new LocalPaper(image, window, bandTop, bandBottom, contrast.paper, Math.max(2, Math.round(PAPER_REACH_WIDTHS * widthPx))) : null;
  for (let i = 0; i < columns; i++) {
    const y0 = bandTop[i];
    const y1 = bandBottom[i];
    if (y1 <= y0) continue;
    const rows = y1 - y0 + 2;
    if (horizontal.length < rows) horizontal = new Float32Array(rows * 2);
    // Horizontal [1 2 1]/4 for rows y0 − 1 … y1 along the column's arc (edges repeat the border pixel), then
    // vertical [1 2 1]/4 on the fly.
    for (let r = 0; r < rows; r++) {
      const y = Math.min(height - 1, Math.max(0, y0 - 1 + r));
      const x = Math.min(width - 1, Math.max(0, x0 + i + Math.round(shift[y])));
      const left = x > 0 ? -channels : 0;
      const right = x < width - 1 ? channels : 0;
      const k = (y * width + x) * channels;
      if (isColour && lut && flat) {
        const a = k + left;
        const c = k + right;
        horizontal[r] = 0.25 * (flat.score(lut, data, a, i) + 2 * flat.score(lut, data, k, i) + flat.score(lut, data, c, i));
      } else if (isColour) {
        const a = k + left;
        const c = k + right;
        const sum =
          wr * (data[a] + 2 * data[k] + data[c]) + wg * (data[a + 1] + 2 * data[k + 1] + data[c + 1]) + wb * (data[a + 2] + 2 * data[k + 2] + data[c + 2]);
        horizontal[r] = offset - 0.25 * sum;
      } else horizontal[r] = offset - 0.25 * wr * (data[k + left] + 2 * data[k] + data[k + right]);
    }
    let start = -1;
    let mass = 0;
    let moment = 0;
    let peak = 0;
    for (let y = y0; y < y1; y++) {
      const r = y - y0 + 1;
      const s = 0.25 * horizontal[r - 1] + 0.5 * horizontal[r] + 0.25 * horizontal[r + 1];
      if (s >= threshold) {
        if (start < 0) {
          start = y;
          mass = 0;
          moment = 0;
          peak = 0;
        }
        mass += s;
        moment += s * (y + 0.5);
        if (s > peak) peak = s;
      } else if (start >= 0) {
        keepRun(runs, i, start, y, mass, moment, peak, widthPx);
        start = -1;
      }
    }
    if (start >= 0) keepRun(runs, i, start, y1, mass, moment, peak, widthPx);
  }
  return runs;
}

/**
 * The paper's colour near each column, for the lab model: a stain or a yellowed patch tints ink and paper alike, and
 * scored against the sheet's paper the ink under it falls off the ink's colour segment. Each pixel is brought back
 * to the sheet's paper by the ratio of the sheet's paper to the local paper per channel (a flat-field correction,
 * common practice in scanning) before it is scored. The local paper is the per-channel median of a column's band
 * (the pen line and the printed lines are a small part of it), brightened to the brightest such median within a
 * few line widths either side: a column that runs along a printed time arc is grid from end to end.
 */
class LocalPaper {
  private readonly factors: Float32Array;

  constructor(image: RawImage, window: ChartWindow, bandTop: Int32Array, bandBottom: Int32Array, paper: { r: number; g: number; b: number }, reach: number) {
    const columns = bandTop.length;
    const { data, width, height, channels } = image;
    const local = [new Float32Array(columns), new Float32Array(columns), new Float32Array(columns)];
    let values = new Uint8Array(0);
    // Stains change over millimetres: one median every half line width is enough (and a third of the cost).
    const stride = Math.max(1, Math.floor(reach / (2 * PAPER_REACH_WIDTHS)));
    for (let i = 0; i < columns; i += stride) {
      const y0 = Math.max(0, bandTop[i]);
      const y1 = Math.min(height, bandBottom[i]);
      const n = y1 - y0;
      if (n <= 0) continue;
      if (values.length < n) values = new Uint8Array(2 * n);
      for (let c = 0; c < 3; c++) {
        for (let y = y0; y < y1; y++) {
          const x = Math.min(width - 1, Math.max(0, window.x0 + i + Math.round(window.rowShift[y])));
          values[y - y0] = data[(y * width + x) * channels + c];
        }
        local[c].fill(values.subarray(0, n).sort()[n >> 1], i, Math.min(columns, i + stride));
      }
    }
    const sheet = [paper.r, paper.g, paper.b];
    this.factors = new Float32Array(3 * columns);
    for (let c = 0; c < 3; c++) {
      const brightest = slidingMaxOf(local[c], reach);
      for (let i = 0; i < columns; i++) {
        const ratio = brightest[i] > 0 ? sheet[c] / brightest[i] : 1;
        // Only a darker local paper is corrected (a stain); within noise of the sheet's paper nothing changes.
        this.factors[3 * i + c] = ratio > MIN_FLAT_FIELD_RATIO ? Math.min(MAX_FLAT_FIELD_RATIO, ratio) : 1;
      }
    }
  }

  score(lut: LabLut, data: Uint8Array | Uint8ClampedArray, k: number, column: number): number {
    const fr = this.factors[3 * column];
    const fg = this.factors[3 * column + 1];
    const fb = this.factors[3 * column + 2];
    if (fr === 1 && fg === 1 && fb === 1) return readLut(lut, data[k], data[k + 1], data[k + 2]);
    return readLut(lut, Math.min(255, data[k] * fr), Math.min(255, data[k + 1] * fg), Math.min(255, data[k + 2] * fb));
  }
}

// A local paper within 3 % of the sheet's is the sheet's (noise, JPEG); a stain darker than 1 / 1.6 is not undone.
const MIN_FLAT_FIELD_RATIO = 1.03;
const MAX_FLAT_FIELD_RATIO = 1.6;
// Reach of the brightest-paper window, line widths either side.
const PAPER_REACH_WIDTHS = 3;

/** How wide the pen line looks down a column: its equivalent width and the length of its runs above threshold. */
export interface LineWidth {
  /** Median mass/peak of strong runs: the width of a solid line with the same ink, px. */
  widthPx: number;
  /** Median length of strong runs above the threshold (includes blurred edges), px. */
  runLengthPx: number;
}

/** Measures the line from strong runs (peak ≥ 0.6); falls back to fallbackPx when too few are found. */
export function measureLineWidth(runs: ColumnRuns, fallbackPx: number): LineWidth {
  const widths: number[] = [];
  const lengths: number[] = [];
  for (let i = 0; i < runs.columns; i++) {
    for (let k = 0; k < runs.count[i]; k++) {
      const j = i * runs.slots + k;
      if (runs.peak[j] < 0.6) continue;
      lengths.push(runs.bottom[j] - runs.top[j]);
      widths.push(runs.mass[j] / runs.peak[j]);
    }
  }
  if (lengths.length < 10) return { widthPx: fallbackPx, runLengthPx: fallbackPx };
  const middle = (values: number[]) => Float32Array.from(values).sort()[values.length >> 1];
  return { widthPx: Math.max(1, middle(widths)), runLengthPx: Math.max(1.5, middle(lengths)) };
}
