import type { SeriesPoint } from '@shared/api/series';
import { type ChartSeries, mergeChartSeries } from '@shared/domain/merge-series';
import type { Db, DbOrTrx } from '../db/database';
import * as seriesRepository from './series.repository';
import type { InkLineSpan, SeriesRange, StoredSeriesPoint } from './series.repository';
import * as stationSeriesRepository from './station-series.repository';
import type { TimeSpan } from './station-series.repository';

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

/** The merged station series of the range, batch by batch in time order; spans are read once per ink line. */
async function* mergeStationSeries(db: DbOrTrx, range: SeriesRange): AsyncGenerator<SeriesPoint[]> {
  const spans = new Map<string, InkLineSpan>();
  for await (const stored of seriesRepository.streamStoredPoints(db, range)) {
    const unknownIds = [...new Set(stored.map((point) => point.inkLineId))].filter((id) => !spans.has(id));
    for (const span of await seriesRepository.findInkLineSpans(db, unknownIds)) spans.set(span.inkLineId, span);
    yield mergeStoredPoints(stored, spans);
  }
}

/** Sorted, disjoint spans covering the given ones (overlapping or touching spans become one). */
export function unionOfSpans(spans: readonly TimeSpan[]): TimeSpan[] {
  const sorted = [...spans].sort((a, b) => a.fromMs - b.fromMs);
  const union: TimeSpan[] = [];
  for (const span of sorted) {
    const last = union[union.length - 1];
    if (last && span.fromMs <= last.toMs + 1) last.toMs = Math.max(last.toMs, span.toMs);
    else union.push({ ...span });
  }
  return union;
}

/** Replaces the materialized series of one span (inclusive ms) with a fresh merge, then its hours and days. */
async function rebuildSpan(trx: DbOrTrx, stationId: string, span: TimeSpan): Promise<number> {
  await stationSeriesRepository.deletePoints(trx, stationId, span);
  let pointCount = 0;
  for await (const points of mergeStationSeries(trx, { stationId, fromMs: span.fromMs, toMs: span.toMs })) {
    await stationSeriesRepository.insertPoints(trx, stationId, points);
    pointCount += points.length;
  }
  await stationSeriesRepository.rebuildAggregates(trx, stationId, span);
  return pointCount;
}

export interface SeriesBuildResult {
  stationId: string;
  /** The series version after the build. */
  version: number;
  /** series_change rows this build read. */
  changeCount: number;
  /** The spans rebuilt (inclusive, epoch ms). */
  spans: TimeSpan[];
  pointCount: number;
}

/**
 * Brings one station's materialized series up to date with its unread series_change rows, in one
 * transaction that holds the station's state row locked (two builds of a station never interleave; a
 * reader waiting on the lock finds nothing left to do). Only the spans of the ink lines that changed are
 * rebuilt: the span where each line has stored points and where the series now shows its points. A
 * change whose ink line is gone (deleted, its points with it) rebuilds the whole station. The version rises
 * by one per change read. Null when there was nothing to read.
 */
export async function buildPendingSeries(db: Db, stationId: string): Promise<SeriesBuildResult | null> {
  return db.transaction().execute(async (trx) => {
    const state = await stationSeriesRepository.lockState(trx, stationId);
    const changes = await stationSeriesRepository.findChangesAfter(trx, stationId, state.lastChangeId);
    if (changes.length === 0) return null;

    const inkLineIds = [...new Set(changes.flatMap((change) => (change.inkLineId ? [change.inkLineId] : [])))];
    const isWholeStation = changes.some((change) => change.inkLineId === null);
    const spans = isWholeStation
      ? await stationSeriesRepository.findWholeStationSpan(trx, stationId)
      : unionOfSpans(await stationSeriesRepository.findSpansOfInkLines(trx, stationId, inkLineIds));
    let pointCount = 0;
    for (const span of spans) pointCount += await rebuildSpan(trx, stationId, span);

    const version = state.version + changes.length;
    await stationSeriesRepository.saveState(trx, stationId, { version, lastChangeId: changes[changes.length - 1].id });
    return { stationId, version, changeCount: changes.length, spans, pointCount };
  });
}

/** Builds every station with unread changes, one transaction each; what the series job and the tests run. */
export async function buildAllPendingSeries(db: Db): Promise<SeriesBuildResult[]> {
  const results: SeriesBuildResult[] = [];
  for (const stationId of await stationSeriesRepository.findStationsWithPendingChanges(db)) {
    const result = await buildPendingSeries(db, stationId);
    if (result) results.push(result);
  }
  return results;
}
