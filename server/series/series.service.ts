import { SERIES_POINT_LIMIT, type SeriesPoint, type SeriesResponse } from '@shared/api/series';
import type { Db } from '../db/database';
import * as stationsService from '../stations/stations.service';
import * as seriesRepository from './series.repository';
import type { SeriesRange } from './series.repository';

export async function getSeries(db: Db, range: SeriesRange): Promise<SeriesResponse> {
  await stationsService.getStation(db, range.stationId);
  // One more than the limit tells whether the range held more.
  const points = await seriesRepository.findSeriesPoints(db, range, SERIES_POINT_LIMIT + 1);
  const truncated = points.length > SERIES_POINT_LIMIT;
  return {
    stationId: range.stationId,
    from: new Date(range.fromMs).toISOString(),
    to: new Date(range.toMs).toISOString(),
    points: truncated ? points.slice(0, SERIES_POINT_LIMIT) : points,
    truncated,
  };
}

/** The station (404 if unknown) and a batch-by-batch reader of every point in the range. */
export async function openSeriesExport(
  db: Db,
  range: SeriesRange,
): Promise<{ stationCode: string; batches: AsyncGenerator<SeriesPoint[]> }> {
  const station = await stationsService.getStation(db, range.stationId);
  return { stationCode: station.code, batches: seriesRepository.streamSeriesPoints(db, range) };
}
