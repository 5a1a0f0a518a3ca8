import type { SeriesPoint } from '@shared/api/series';

import type { PlotScales } from './plot-scales';

/**
 * SVG path data for the uncertainty band: one closed shape per run of neighbouring points that carry an
 * uncertainty, from pressure + u along the top (left to right) back along pressure − u (right to left).
 * A run ends where the line is lifted (a gap point, or neighbours more than maxStepMs apart) and at a point
 * without an uncertainty, so the band never claims a bound it does not have. A run of one point has no area
 * and is left out.
 */
export function buildUncertaintyBandPath(points: readonly SeriesPoint[], scales: PlotScales, maxStepMs: number): string {
  let path = '';
  let run: SeriesPoint[] = [];
  let previousMs: number | null = null;
  const closeRun = () => {
    if (run.length >= 2) path += bandShape(run, scales);
    run = [];
  };
  for (const point of points) {
    const timeMs = Date.parse(point.time);
    const hasBand = point.flag !== 'gap' && Number.isFinite(point.pressureHpa) && point.uncertaintyHpa !== null && Number.isFinite(point.uncertaintyHpa);
    if (!hasBand) {
      closeRun();
      previousMs = null;
      continue;
    }
    if (previousMs !== null && timeMs - previousMs > maxStepMs) closeRun();
    run.push(point);
    previousMs = timeMs;
  }
  closeRun();
  return path;
}

function bandShape(run: readonly SeriesPoint[], { x, y }: PlotScales): string {
  const upper = run.map((point) => `${round(x(new Date(point.time)))},${round(y(point.pressureHpa + (point.uncertaintyHpa as number)))}`);
  const lower = run
    .slice()
    .reverse()
    .map((point) => `${round(x(new Date(point.time)))},${round(y(point.pressureHpa - (point.uncertaintyHpa as number)))}`);
  return `M${upper.join('L')}L${lower.join('L')}Z`;
}

function round(value: number): number {
  return Math.round(value * 10) / 10;
}
