import type { Page, PageQuery } from '@shared/api/paging';
import type { StationInput, StationPatch, StationSortKey, StationSummary } from '@shared/api/stations';
import type { DbOrTrx } from '../db/database';
import { PG_UNIQUE_VIOLATION, pgConstraint, pgErrorCode } from '../db/pg-errors';
import { AppError, HTTP } from '../errors/app-error';
import { versionConflict } from '../http/version-conflict';
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

/** A second station with the same code or WIGOS id is refused with the field named. */
function uniqueViolation(error: unknown): never {
  if (pgErrorCode(error) === PG_UNIQUE_VIOLATION) {
    const field = pgConstraint(error) === 'station_wigos_id_key' ? 'wigosId' : 'code';
    throw new AppError(HTTP.conflict, 'station_identifier_taken', `Another station already has this ${field === 'code' ? 'code' : 'WIGOS id'}.`, {
      [field]: 'already used by another station',
    });
  }
  throw error;
}

export async function createStation(db: DbOrTrx, input: StationInput): Promise<StationSummary> {
  return stationsRepository.insertStation(db, input).catch(uniqueViolation);
}

export async function updateStation(db: DbOrTrx, stationId: string, patch: StationPatch): Promise<StationSummary> {
  const { version, ...fields } = patch;
  const updated = await stationsRepository.updateStation(db, stationId, version, fields).catch(uniqueViolation);
  if (updated) return updated;
  const current = await getStation(db, stationId);
  throw versionConflict('station', current.version);
}
