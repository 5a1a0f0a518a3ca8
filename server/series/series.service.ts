import { SERIES_POINT_LIMIT, type SeriesPoint, type SeriesResponse } from '@shared/api/series';
import { type ChartSeries, mergeChartSeries } from '@shared/domain/merge-series';
import type { Db } from '../db/database';
import * as stationsService from '../stations/stations.service';
import * as seriesRepository from './series.repository';
import type { InkLineSpan, SeriesRange, StoredSeriesPoint } from './series.repository';

/**
 * Coverage factor k of the overlap check: two ink lines disagreeing by more than k·√(u₁² + u₂²) make the
 * point suspect. k = 2 covers about 95 % of honest disagreements (GUM, JCGM 100:2008 §6.3, from memory);
 * k = 1 would flag a third of them.
 */
const SUSPECT_COVERAGE_FACTOR = 2;

/**
 * Merges one batch of stored points (whole times, see streamStoredPoints) into the station series, one point
 * per time. Merge rule: project design, see shared/domain/merge-series.ts (the most interior chart wins;
 * a disagreement beyond the combined uncertainty is suspect). Each ink line is one chart, spanning its
 * InkLineSpan.
 */
export function mergeStoredPoints(points: readonly StoredSeriesPoint[], spans: ReadonlyMap<string, InkLineSpan>): SeriesPoint[] {
  const charts = new Map<string, ChartSeries>();
  for (const point of points) {
    let chart = charts.get(point.inkLineId);
    if (!chart) {
      const span = spans.get(point.inkLineId);
      chart = {
        sourceId: point.inkLineId,
        chartOnMs: span?.startMs ?? point.timeMs,
        chartOffMs: span?.endMs ?? point.timeMs,
        points: [],
      };
      charts.set(point.inkLineId, chart);
    }
    chart.points.push({ timeMs: point.timeMs, pressureHpa: point.pressureHpa, flag: point.flag, uncertaintyHpa: point.uncertaintyHpa });
  }
  // Ink lines in id order, so that a tie (a cross-trace of the same chart) always goes the same way.
  const ordered = [...charts.values()].sort((a, b) => (a.sourceId < b.sourceId ? -1 : a.sourceId > b.sourceId ? 1 : 0));
  return mergeChartSeries(ordered, { coverageFactor: SUSPECT_COVERAGE_FACTOR }).flatMap((merged) =>
    // Stored points always carry a pressure, so every merged point has one and a source.
    merged.pressureHpa === null || merged.sourceId === null
      ? []
      : [
          {
            time: new Date(merged.timeMs).toISOString(),
            pressureHpa: merged.pressureHpa,
            flag: merged.flag,
            uncertaintyHpa: merged.uncertaintyHpa,
            inkLineId: merged.sourceId,
          },
        ],
  );
}

interface MergedBatch {
  stored: StoredSeriesPoint[];
  points: SeriesPoint[];
}

/** The station series of the range, merged batch by batch in time order; spans are read once per ink line. */
async function* mergeStationSeries(db: Db, range: SeriesRange): AsyncGenerator<MergedBatch> {
  const spans = new Map<string, InkLineSpan>();
  for await (const stored of seriesRepository.streamStoredPoints(db, range)) {
    const unknownIds = [...new Set(stored.map((point) => point.inkLineId))].filter((id) => !spans.has(id));
    for (const span of await seriesRepository.findInkLineSpans(db, unknownIds)) spans.set(span.inkLineId, span);
    yield { stored, points: mergeStoredPoints(stored, spans) };
  }
}

export async function getSeries(db: Db, range: SeriesRange): Promise<SeriesResponse> {
  await stationsService.getStation(db, range.stationId);
  const points: SeriesPoint[] = [];
  const sourceIds = new Set<string>();
  let truncated = false;
  for await (const batch of mergeStationSeries(db, range)) {
    const room = SERIES_POINT_LIMIT - points.length;
    const kept = batch.points.slice(0, room);
    points.push(...kept);
    // Count the ink lines behind the points kept: a line seen only after the cut did not contribute.
    const lastKeptMs = kept.length > 0 ? Date.parse(kept[kept.length - 1].time) : Number.NEGATIVE_INFINITY;
    for (const stored of batch.stored) if (stored.timeMs <= lastKeptMs) sourceIds.add(stored.inkLineId);
    if (batch.points.length > room) {
      truncated = true;
      break;
    }
  }
  return {
    stationId: range.stationId,
    from: new Date(range.fromMs).toISOString(),
    to: new Date(range.toMs).toISOString(),
    points,
    truncated,
    sourceCount: sourceIds.size,
  };
}

/** The station (404 if unknown) and a batch-by-batch reader of the merged station series of the range. */
export async function openSeriesExport(
  db: Db,
  range: SeriesRange,
): Promise<{ stationCode: string; batches: AsyncGenerator<SeriesPoint[]> }> {
  const station = await stationsService.getStation(db, range.stationId);
  async function* pointBatches(): AsyncGenerator<SeriesPoint[]> {
    for await (const batch of mergeStationSeries(db, range)) yield batch.points;
  }
  return { stationCode: station.code, batches: pointBatches() };
}
