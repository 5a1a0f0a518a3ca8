import type { SeriesPoint } from '@shared/api/series';
import type { RawSeriesPoint, SeriesBucket, StationSeries } from '@shared/api/series-query';

/**
 * One plotted point: a raw point as it is, or a bucket as its asked-for value (pressureHpa) with the mean
 * uncertainty of its points. `flaggedShare` (0–1) is the share of a bucket's points that were flagged; a raw
 * point's is 1 or 0 by its own flag. `minHpa`/`maxHpa` are the bucket's range (a raw point's own value).
 */
export interface PlotPoint extends SeriesPoint {
  timeMs: number;
  flaggedShare: number;
  minHpa: number;
  maxHpa: number;
  /** Points behind it: 1 for a raw point. */
  count: number;
}

function isBucket(point: RawSeriesPoint | SeriesBucket): point is SeriesBucket {
  return 'meanHpa' in point;
}

/** The plotted points of one station's answer, in time order. A bucket carries flag ok: its flags are in flaggedShare. */
export function toPlotPoints(series: StationSeries): PlotPoint[] {
  return (series.points as (RawSeriesPoint | SeriesBucket)[]).map((point) =>
    isBucket(point)
      ? {
          time: point.time,
          timeMs: Date.parse(point.time),
          pressureHpa: point.pressureHpa,
          flag: 'ok',
          uncertaintyHpa: point.uncertaintyHpa,
          inkLineId: '',
          flaggedShare: point.flaggedShare,
          minHpa: point.minHpa,
          maxHpa: point.maxHpa,
          count: point.count,
        }
      : {
          time: point.time,
          timeMs: Date.parse(point.time),
          pressureHpa: point.pressureHpa,
          flag: point.flag,
          uncertaintyHpa: point.uncertaintyHpa,
          inkLineId: point.inkLineId,
          flaggedShare: point.flag === 'ok' ? 0 : 1,
          minHpa: point.pressureHpa,
          maxHpa: point.pressureHpa,
          count: 1,
        },
  );
}

/** The index of the point nearest in time to timeMs (binary search over points in time order), or -1 for none. */
export function nearestPointIndex(points: readonly { timeMs: number }[], timeMs: number): number {
  if (points.length === 0) return -1;
  let low = 0;
  let high = points.length - 1;
  while (high - low > 1) {
    const middle = (low + high) >> 1;
    if (points[middle].timeMs <= timeMs) low = middle;
    else high = middle;
  }
  return Math.abs(points[low].timeMs - timeMs) <= Math.abs(points[high].timeMs - timeMs) ? low : high;
}

/** The points inside [fromMs, toMs], with one neighbour either side so the line reaches the plot's edges. */
export function pointsInView<T extends { timeMs: number }>(points: readonly T[], fromMs: number, toMs: number): T[] {
  let first = points.findIndex((point) => point.timeMs >= fromMs);
  if (first === -1) return points.length > 0 && points[points.length - 1].timeMs < fromMs ? points.slice(-1) : [];
  let last = first;
  while (last < points.length && points[last].timeMs <= toMs) last++;
  first = Math.max(0, first - 1);
  return points.slice(first, Math.min(points.length, last + 1));
}

/** Path data of a min–max band over buckets (the overview's daily range), x and y given as functions. */
export function rangeBandPath(points: readonly PlotPoint[], x: (timeMs: number) => number, y: (hPa: number) => number, maxStepMs: number): string {
  let path = '';
  let run: PlotPoint[] = [];
  const close = () => {
    if (run.length >= 2) {
      const top = run.map((point) => `${round(x(point.timeMs))},${round(y(point.maxHpa))}`);
      const bottom = run
        .slice()
        .reverse()
        .map((point) => `${round(x(point.timeMs))},${round(y(point.minHpa))}`);
      path += `M${top.join('L')}L${bottom.join('L')}Z`;
    } else if (run.length === 1) {
      // A lone day still shows: a thin bar from its minimum to its maximum.
      const only = run[0];
      path += `M${round(x(only.timeMs) - 1)},${round(y(only.maxHpa))}L${round(x(only.timeMs) + 1)},${round(y(only.maxHpa))}L${round(x(only.timeMs) + 1)},${round(y(only.minHpa))}L${round(x(only.timeMs) - 1)},${round(y(only.minHpa))}Z`;
    }
    run = [];
  };
  for (const point of points) {
    const previous = run[run.length - 1];
    if (previous && point.timeMs - previous.timeMs > maxStepMs) close();
    run.push(point);
  }
  close();
  return path;
}

function round(value: number): number {
  return Math.round(value * 10) / 10;
}
