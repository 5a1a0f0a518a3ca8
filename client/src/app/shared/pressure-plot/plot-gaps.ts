import type { SeriesPoint } from '@shared/api/series';

import type { XY } from '../plot-marks/gap-brackets';
import type { PlotScales } from './plot-scales';

/**
 * The ends of every place the line is lifted (gap points, or neighbours more than maxStepMs apart, the same
 * rule as buildLinePath): the last drawn point before and the first drawn point after, in plot units. A gap
 * at either end of the points has only one drawn neighbour and no brackets.
 */
export function findGapEnds(points: readonly SeriesPoint[], scales: PlotScales, maxStepMs: number): { before: XY; after: XY }[] {
  const ends: { before: XY; after: XY }[] = [];
  let previous: { timeMs: number; at: XY } | null = null;
  let sawGap = false;
  for (const point of points) {
    if (point.flag === 'gap' || !Number.isFinite(point.pressureHpa)) {
      sawGap = true;
      continue;
    }
    const timeMs = Date.parse(point.time);
    const at = { x: scales.x(new Date(timeMs)), y: scales.y(point.pressureHpa) };
    if (previous && (sawGap || timeMs - previous.timeMs > maxStepMs)) ends.push({ before: previous.at, after: at });
    previous = { timeMs, at };
    sawGap = false;
  }
  return ends;
}
