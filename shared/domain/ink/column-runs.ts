import type { ChartWindow } from './chart-window';
import type { InkContrast } from './ink-contrast';
import type { RawImage } from './raw-image';

/**
 * Per image column, the runs of ink-scoring pixels found down that column: the candidates the path search
 * picks from. Flat typed arrays, `slots` entries per column; entry k of column i is at i·slots + k.
 */
export interface ColumnRuns {
  x0: number;
  columns: number;
  slots: number;
  count: Uint8Array;
  /** First row of the run and the row after its last (pixel edges, continuous coordinates). */
  top: Float32Array;
  bottom: Float32Array;
  /** Score-weighted centre, continuous coordinates. */
  centre: Float32Array;
  /** Sum and peak of the smoothed score over the run. */
  mass: Float32Array;
  peak: Float32Array;
}

/** Candidate runs kept per column; the rest (weakest first) are dropped. */
export const RUN_SLOTS = 8;

/**
 * Scores the window row by row (cache-friendly for interleaved pixels), smooths the score with a 3×3
 * binomial kernel to tame sensor noise and JPEG blocks, and closes runs down every column at once.
 * provisionalWidthPx only ranks runs for the slot list; the path search re-weighs them with the measured width.
 */
export function findColumnRuns(image: RawImage, window: ChartWindow, contrast: InkContrast, provisionalWidthPx: number): ColumnRuns {
  const columns = Math.max(0, window.x1 - window.x0);
  const slots = RUN_SLOTS;
  const runs: ColumnRuns = {
    x0: window.x0,
    columns,
    slots,
    count: new Uint8Array(columns),
    top: new Float32Array(columns * slots),
    bottom: new Float32Array(columns * slots),
    centre: new Float32Array(columns * slots),
    mass: new Float32Array(columns * slots),
    peak: new Float32Array(columns * slots),
  };
  if (columns === 0) return runs;
  let yMin = image.height;
  let yMax = 0;
  for (let i = 0; i < columns; i++) {
    yMin = Math.min(yMin, window.rowTop[i]);
    yMax = Math.max(yMax, window.rowBottom[i]);
  }
  if (yMax <= yMin) return runs;

  const { data, width, channels } = image;
  const { offset, threshold } = contrast;
  const isColour = channels >= 3;
  const wr = isColour ? contrast.wr : contrast.wr + contrast.wg + contrast.wb;
  const wg = contrast.wg;
  const wb = contrast.wb;
  const rawRow = new Float32Array(columns + 2);
  // Three horizontally smoothed rows, rotated: a = y − 2, b = y − 1, c = y.
  let rowA = new Float32Array(columns);
  let rowB = new Float32Array(columns);
  let rowC = new Float32Array(columns);
  const runStart = new Int32Array(columns).fill(-1);
  const runMass = new Float64Array(columns);
  const runMoment = new Float64Array(columns);
  const runPeak = new Float32Array(columns);
  const rowTop = window.rowTop;
  const rowBottom = window.rowBottom;
  const x0 = window.x0;
  const left = Math.max(0, x0 - 1);
  const right = Math.min(width, window.x1 + 1);

  const closeRun = (i: number, endRow: number): void => {
    const start = runStart[i];
    runStart[i] = -1;
    const length = endRow - start;
    const mass = runMass[i];
    const peak = runPeak[i];
    const rank = 0.5 * (mass / Math.max(length, provisionalWidthPx)) + 0.5 * peak;
    const base = i * slots;
    let k = runs.count[i];
    if (k === slots) {
      // Full: replace the weakest if this run ranks above it.
      let weakest = 0;
      let weakestRank = Infinity;
      for (let s = 0; s < slots; s++) {
        const len = runs.bottom[base + s] - runs.top[base + s];
        const r = 0.5 * (runs.mass[base + s] / Math.max(len, provisionalWidthPx)) + 0.5 * runs.peak[base + s];
        if (r < weakestRank) {
          weakestRank = r;
          weakest = s;
        }
      }
      if (weakestRank >= rank) return;
      k = weakest;
    } else runs.count[i] = k + 1;
    runs.top[base + k] = start;
    runs.bottom[base + k] = endRow;
    runs.centre[base + k] = mass > 0 ? runMoment[i] / mass : (start + endRow) / 2;
    runs.mass[base + k] = mass;
    runs.peak[base + k] = peak;
  };

  const scoreRow = (y: number, out: Float32Array): void => {
    if (y < 0 || y >= image.height) {
      out.fill(0);
      return;
    }
    rawRow.fill(0);
    let k = (y * width + left) * channels;
    for (let x = left; x < right; x++, k += channels) {
      const s = isColour ? offset - (wr * data[k] + wg * data[k + 1] + wb * data[k + 2]) : offset - wr * data[k];
      rawRow[x - x0 + 1] = s;
    }
    for (let i = 0; i < columns; i++) out[i] = 0.25 * rawRow[i] + 0.5 * rawRow[i + 1] + 0.25 * rawRow[i + 2];
  };

  scoreRow(yMin - 1, rowB);
  scoreRow(yMin, rowC);
  for (let y = yMin; y < yMax; y++) {
    const recycled = rowA;
    rowA = rowB;
    rowB = rowC;
    rowC = recycled;
    scoreRow(y + 1, rowC);
    // rowB is row y now; smooth vertically and update every column's run.
    const centreY = y + 0.5;
    for (let i = 0; i < columns; i++) {
      if (y < rowTop[i] || y >= rowBottom[i]) {
        if (runStart[i] >= 0) closeRun(i, y);
        continue;
      }
      const s = 0.25 * rowA[i] + 0.5 * rowB[i] + 0.25 * rowC[i];
      if (s >= threshold) {
        if (runStart[i] < 0) {
          runStart[i] = y;
          runMass[i] = 0;
          runMoment[i] = 0;
          runPeak[i] = 0;
        }
        runMass[i] += s;
        runMoment[i] += s * centreY;
        if (s > runPeak[i]) runPeak[i] = s;
      } else if (runStart[i] >= 0) closeRun(i, y);
    }
  }
  for (let i = 0; i < columns; i++) if (runStart[i] >= 0) closeRun(i, yMax);
  return runs;
}

/** Median vertical length of strong runs: the pen line's width in pixels as seen down a column. */
export function measureLineWidthPx(runs: ColumnRuns, fallbackPx: number): number {
  const lengths: number[] = [];
  for (let i = 0; i < runs.columns; i++) {
    for (let k = 0; k < runs.count[i]; k++) {
      const j = i * runs.slots + k;
      if (runs.peak[j] >= 0.6) lengths.push(runs.bottom[j] - runs.top[j]);
    }
  }
  if (lengths.length < 10) return fallbackPx;
  const sorted = Float32Array.from(lengths).sort();
  return Math.max(1.5, sorted[sorted.length >> 1]);
}
