import { SERIES_FLAGS, SERIES_POINT_LIMIT, type SeriesPoint, type SeriesResponse } from '@shared/api/series';
import type { SeriesQueryResponse, StationSeries } from '@shared/api/series-query';
import type { StationSummary } from '@shared/api/stations';
import type { Db } from '../db/database';
import * as stationsService from '../stations/stations.service';
import type { SeriesQuery } from './parse-series-query';
import { buildPendingSeries } from './series-build';
import * as seriesReadRepository from './series-read.repository';
import type { SeriesRange } from './series.repository';
import * as stationSeriesRepository from './station-series.repository';

export interface SeriesVersion {
  version: number;
  builtAt: string | null;
}

/**
 * The station's series version, built first when series_change rows wait that the series job has not read
 * yet: a reader always sees every decision already made (the job keeps this quick by building ahead).
 */
export async function currentSeriesVersion(db: Db, stationId: string): Promise<SeriesVersion> {
  let state = await stationSeriesRepository.findState(db, stationId);
  if (state.hasPendingChanges) {
    await buildPendingSeries(db, stationId);
    state = await stationSeriesRepository.findState(db, stationId);
  }
  return { version: state.version, builtAt: state.builtAt ? state.builtAt.toISOString() : null };
}

/** One station's merged points over a range (the Lessons passage and GET /api/series), at most SERIES_POINT_LIMIT. */
export async function getSeries(db: Db, range: SeriesRange): Promise<SeriesResponse> {
  await stationsService.getStation(db, range.stationId);
  const { version, builtAt } = await currentSeriesVersion(db, range.stationId);
  const read = await seriesReadRepository.readRawPoints(db, { ...range, flags: null }, false, SERIES_POINT_LIMIT + 1);
  const truncated = read.length > SERIES_POINT_LIMIT;
  const points: SeriesPoint[] = read.slice(0, SERIES_POINT_LIMIT);
  return {
    stationId: range.stationId,
    from: new Date(range.fromMs).toISOString(),
    to: new Date(range.toMs).toISOString(),
    points,
    truncated,
    sourceCount: new Set(points.map((point) => point.inkLineId)).size,
    version,
    builtAt,
  };
}

/** The station (404 if unknown), its version and a batch-by-batch reader of its merged points over the range. */
export async function openSeriesExport(
  db: Db,
  range: SeriesRange,
): Promise<{ station: StationSummary; version: SeriesVersion; batches: AsyncGenerator<SeriesPoint[]> }> {
  const station = await stationsService.getStation(db, range.stationId);
  const version = await currentSeriesVersion(db, range.stationId);
  return { station, version, batches: seriesReadRepository.streamRawPoints(db, { ...range, flags: null }) };
}

/** Stations of a query in the order asked (404 station_not_found for the first unknown one). */
export async function getQueryStations(db: Db, stationIds: readonly string[]): Promise<StationSummary[]> {
  const stations: StationSummary[] = [];
  for (const stationId of stationIds) stations.push(await stationsService.getStation(db, stationId));
  return stations;
}

/** One station's part of a query answer: its version, and its points or buckets at the step. */
export async function queryStationSeries(db: Db, station: StationSummary, query: SeriesQuery): Promise<StationSeries> {
  const { version, builtAt } = await currentSeriesVersion(db, station.id);
  const read = { stationId: station.id, fromMs: query.fromMs, toMs: query.toMs, flags: query.flags };
  const points =
    query.step === 'raw'
      ? await seriesReadRepository.readRawPoints(db, read, query.withProvenance)
      : await seriesReadRepository.readBuckets(db, read, query.step, query.aggregate);
  return { stationId: station.id, stationCode: station.code, stationName: station.name, version, builtAt, points };
}

/**
 * GET /api/series/query as JSON text (the shape of SeriesQueryResponse). The points come as JSON built by
 * PostgreSQL (series-read.repository.ts), spliced into the envelope; provenance takes the row path.
 */
export async function querySeriesJson(db: Db, query: SeriesQuery): Promise<string> {
  if (query.withProvenance) return JSON.stringify(await querySeries(db, query));
  const stations = await getQueryStations(db, query.stationIds);
  const parts: string[] = [];
  for (const station of stations) parts.push(await queryStationSeriesJson(db, station, query));
  const envelope = JSON.stringify({
    from: new Date(query.fromMs).toISOString(),
    to: new Date(query.toMs).toISOString(),
    step: query.step,
    aggregate: query.step === 'raw' ? null : query.aggregate,
    flags: query.flags ?? [...SERIES_FLAGS],
  });
  return `${envelope.slice(0, -1)},"stations":[${parts.join(',')}]}`;
}

/** One station's part of querySeriesJson. */
export async function queryStationSeriesJson(db: Db, station: StationSummary, query: SeriesQuery): Promise<string> {
  const { version, builtAt } = await currentSeriesVersion(db, station.id);
  const read = { stationId: station.id, fromMs: query.fromMs, toMs: query.toMs, flags: query.flags };
  const points =
    query.step === 'raw' ? await seriesReadRepository.readRawPointsJson(db, read) : await seriesReadRepository.readBucketsJson(db, read, query.step, query.aggregate);
  const head = JSON.stringify({ stationId: station.id, stationCode: station.code, stationName: station.name, version, builtAt });
  return `${head.slice(0, -1)},"points":${points}}`;
}

/** GET /api/series/query as objects: every station's series at the step (the range was checked against the row limit). */
export async function querySeries(db: Db, query: SeriesQuery): Promise<SeriesQueryResponse> {
  const stations = await getQueryStations(db, query.stationIds);
  const series: StationSeries[] = [];
  for (const station of stations) series.push(await queryStationSeries(db, station, query));
  return {
    from: new Date(query.fromMs).toISOString(),
    to: new Date(query.toMs).toISOString(),
    step: query.step,
    aggregate: query.step === 'raw' ? null : query.aggregate,
    flags: query.flags ?? [...SERIES_FLAGS],
    stations: series,
  };
}
