import type { Page, PageQuery } from '@shared/api/paging';
import type { StationSortKey, StationSummary } from '@shared/api/stations';
import type { DbOrTrx } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import * as stationsRepository from './stations.repository';

export async function listStations(db: DbOrTrx, query: PageQuery<StationSortKey>): Promise<Page<StationSummary>> {
  const { items, total } = await stationsRepository.listStations(db, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

/** The station, or 404 station_not_found. */
export async function getStation(db: DbOrTrx, stationId: string): Promise<StationSummary> {
  const station = await stationsRepository.findStationById(db, stationId);
  if (!station) throw new AppError(HTTP.notFound, 'station_not_found', 'There is no station with this id.');
  return station;
}
