import type { ChartWindow } from './chart-window';
import { findCoarseRuns, measureLineWidth } from './column-runs';
import type { InkContrast } from './ink-contrast';
import { adaptRunsToLocalStrength } from './local-strength';
import { type PathCosts, type PathSeed, searchInkPath } from './path-search';
import type { RawImage } from './raw-image';

/**
 * Rows to search in every column. Large scans first find the line on a sparse lattice of columns and rows
 * (a few per line width), then search only a band around that coarse path; columns where the coarse path
 * saw no ink are searched in full, so faint ink the coarse pass missed can still be found.
 */
export function findBand(
  image: RawImage,
  window: ChartWindow,
  contrast: InkContrast,
  widthPx: number,
  costs: PathCosts,
  seed: PathSeed | undefined,
  localReachPx: number,
): { top: Int32Array; bottom: Int32Array } {
  const columnStep = Math.max(1, Math.round(1.2 * widthPx));
  const rowStep = Math.max(1, Math.round(widthPx / 2.5));
  const columns = window.rowTop.length;
  if (columnStep < 2) return { top: window.rowTop, bottom: window.rowBottom };
  const coarse = findCoarseRuns(image, window, contrast, columnStep, rowStep, widthPx);
  if (contrast.mode === 'lab') adaptRunsToLocalStrength(coarse, localReachPx / columnStep, contrast.threshold);
  const coarseWidthPx = Math.max(widthPx, measureLineWidth(coarse, widthPx).runLengthPx);
  const coarseSeed = seed && { column: Math.floor(seed.column / columnStep), yPx: seed.yPx, radiusPx: seed.radiusPx + rowStep };
  const chosen = searchInkPath(coarse, coarseWidthPx, costs, coarseSeed, rowStep);
  const top = new Int32Array(columns);
  const bottom = new Int32Array(columns);
  const margin = Math.ceil(2 * widthPx + 2 * rowStep + 2);
  // Where the coarse path saw no ink, search around the nearest ink it saw on either side, widely.
  const wideMargin = margin + Math.ceil(3 * window.pxPerMm);
  const extentLow = new Float64Array(coarse.columns).fill(Infinity);
  const extentHigh = new Float64Array(coarse.columns).fill(-Infinity);
  for (let n = 0; n < coarse.columns; n++) {
    if (chosen[n] < 0) continue;
    const j = n * coarse.slots + chosen[n];
    extentLow[n] = coarse.top[j];
    extentHigh[n] = coarse.bottom[j];
  }
  const nearestLeft = new Int32Array(coarse.columns).fill(-1);
  const nearestRight = new Int32Array(coarse.columns).fill(-1);
  for (let n = 0, last = -1; n < coarse.columns; n++) {
    if (chosen[n] >= 0) last = n;
    nearestLeft[n] = last;
  }
  for (let n = coarse.columns - 1, last = -1; n >= 0; n--) {
    if (chosen[n] >= 0) last = n;
    nearestRight[n] = last;
  }
  for (let i = 0; i < columns; i++) {
    const c = Math.min(coarse.columns - 1, Math.floor(i / columnStep));
    const d = Math.min(coarse.columns - 1, c + 1);
    let low = Math.min(extentLow[c], extentLow[d]);
    let high = Math.max(extentHigh[c], extentHigh[d]);
    let pad = margin;
    // Next to a coarse gap (a pen skip, or a jump too steep for the sparse columns) reach to the ink on both sides.
    if (chosen[c] < 0 || chosen[d] < 0) {
      for (const n of [nearestLeft[c], nearestRight[d]]) {
        if (n < 0) continue;
        low = Math.min(low, extentLow[n]);
        high = Math.max(high, extentHigh[n]);
      }
      pad = wideMargin;
    }
    if (low === Infinity) {
      top[i] = window.rowTop[i];
      bottom[i] = window.rowBottom[i];
    } else {
      top[i] = Math.max(window.rowTop[i], Math.floor(low) - pad);
      bottom[i] = Math.min(window.rowBottom[i], Math.ceil(high) + pad);
    }
  }
  return { top, bottom };
}

