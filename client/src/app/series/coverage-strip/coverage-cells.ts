import type { CoverageMonth } from '@shared/api/series-query';

/** One month of the coverage strip, in the strip's units: where it sits, and what it holds. */
export interface CoverageCell {
  month: string;
  x: number;
  width: number;
  /** 'data': merged points; 'charts': scans but no points yet. */
  kind: 'data' | 'charts';
  /** 0–1: the month's points against the fullest month's. */
  fullness: number;
  title: string;
  fromMs: number;
  toMs: number;
}

/** UTC start of a YYYY-MM month, epoch ms. */
export function monthStartMs(month: string): number {
  return Date.UTC(Number(month.slice(0, 4)), Number(month.slice(5, 7)) - 1, 1);
}

/** The month after a YYYY-MM month, epoch ms of its start. */
export function nextMonthStartMs(month: string): number {
  return Date.UTC(Number(month.slice(0, 4)), Number(month.slice(5, 7)), 1);
}

/**
 * The strip's cells: every month of the coverage placed along [left, right] by time over the span from the
 * first to the last month, at least `minWidth` wide so a lone month in a century still shows.
 */
export function coverageCells(months: readonly CoverageMonth[], left: number, right: number, minWidth = 2): CoverageCell[] {
  if (months.length === 0) return [];
  const startMs = monthStartMs(months[0].month);
  const endMs = nextMonthStartMs(months[months.length - 1].month);
  const scale = (right - left) / (endMs - startMs);
  const fullest = Math.max(1, ...months.map((month) => month.pointCount));
  return months.map((month) => {
    const fromMs = monthStartMs(month.month);
    const toMs = nextMonthStartMs(month.month);
    const kind = month.pointCount > 0 ? 'data' : 'charts';
    const charts = `${month.chartCount} ${month.chartCount === 1 ? 'chart' : 'charts'}`;
    return {
      month: month.month,
      x: left + (fromMs - startMs) * scale,
      width: Math.max(minWidth, (toMs - fromMs) * scale),
      kind,
      fullness: month.pointCount / fullest,
      title: kind === 'data' ? `${month.month}: ${month.pointCount} points from ${charts}` : `${month.month}: ${charts}, none in the series yet`,
      fromMs,
      toMs: toMs - 1,
    };
  });
}
