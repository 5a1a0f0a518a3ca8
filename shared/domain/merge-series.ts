import type { RegularPoint } from './resample';

/** One chart's regular series with the chart's own span (chart on / chart off, UTC epoch ms). */
export interface ChartSeries {
  sourceId: string;
  chartOnMs: number;
  chartOffMs: number;
  points: RegularPoint[];
}

/** A merged point: the chosen chart's point, the chart it came from (null when none had it) and the largest disagreement seen, hPa. */
export interface MergedPoint extends RegularPoint {
  sourceId: string | null;
  disagreementHpa: number | null;
}

/** Options: coverageFactor k (default 1) multiplies the combined uncertainty; defaultUncertaintyHpa (default 0.5) stands in for a missing one. */
export interface MergeOptions {
  coverageFactor?: number;
  defaultUncertaintyHpa?: number;
}

/**
 * Merges the series of consecutive charts that overlap at chart changes, one point per time (ascending).
 * At each time the chart whose span is most interior (furthest from its own chart on / off) wins, because
 * the pen line is least reliable where the chart was being fitted or removed; between equally interior charts
 * (two ink lines of one chart) the smaller uncertainty wins. A value beats a gap, and an
 * on-scale value beats an off-scale one. Where another chart's value differs by more than
 * k·√(u₁² + u₂²), the chosen point is flagged 'suspect'.
 */
export function mergeChartSeries(series: ChartSeries[], options: MergeOptions = {}): MergedPoint[] {
  const coverageFactor = options.coverageFactor ?? 1;
  // ~0.5 hPa: docs/references.md §6 puts a digitized barogram at ±0.5–1 hPa absolute (from memory there).
  const defaultUncertaintyHpa = options.defaultUncertaintyHpa ?? 0.5;
  const byTime = new Map<number, { chart: ChartSeries; point: RegularPoint }[]>();
  for (const chart of series) {
    for (const point of chart.points) {
      const list = byTime.get(point.timeMs) ?? [];
      list.push({ chart, point });
      byTime.set(point.timeMs, list);
    }
  }
  const times = [...byTime.keys()].sort((a, b) => a - b);
  return times.map((timeMs) => {
    const candidates = byTime.get(timeMs) ?? [];
    // Two lines of one chart (a cross-trace) tie on span: then the smaller uncertainty wins.
    const ranked = candidates
      .slice()
      .sort((a, b) => rank(b, timeMs) - rank(a, timeMs) || (a.point.uncertaintyHpa ?? defaultUncertaintyHpa) - (b.point.uncertaintyHpa ?? defaultUncertaintyHpa));
    const chosen = ranked[0];
    if (chosen.point.pressureHpa === null) {
      return { ...chosen.point, flag: 'gap', pressureHpa: null, uncertaintyHpa: null, sourceId: null, disagreementHpa: null };
    }
    let disagreementHpa: number | null = null;
    let isSuspect = false;
    for (const other of ranked.slice(1)) {
      if (other.point.pressureHpa === null || other.point.flag === 'off_scale' || chosen.point.flag === 'off_scale') continue;
      const difference = Math.abs(other.point.pressureHpa - chosen.point.pressureHpa);
      disagreementHpa = Math.max(disagreementHpa ?? 0, difference);
      const combined = Math.hypot(chosen.point.uncertaintyHpa ?? defaultUncertaintyHpa, other.point.uncertaintyHpa ?? defaultUncertaintyHpa);
      if (difference > coverageFactor * combined) isSuspect = true;
    }
    return { ...chosen.point, flag: isSuspect ? 'suspect' : chosen.point.flag, sourceId: chosen.chart.sourceId, disagreementHpa };
  });
}

/** Larger is better: on-scale values first, then off-scale values, then gaps; within a class, the more interior span. */
function rank(candidate: { chart: ChartSeries; point: RegularPoint }, timeMs: number): number {
  const { chart, point } = candidate;
  const hasValue = point.pressureHpa !== null && point.flag !== 'gap';
  const classScore = !hasValue ? 0 : point.flag === 'off_scale' ? 1 : 2;
  const interiorMs = Math.min(timeMs - chart.chartOnMs, chart.chartOffMs - timeMs);
  // Class dominates; interior distance (bounded well below 1e15 ms) breaks ties within a class.
  return classScore * 1e15 + interiorMs;
}
