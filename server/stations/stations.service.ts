import type { Page, PageQuery } from '@shared/api/paging';
import type { StationInput, StationPatch, StationSortKey, StationSummary } from '@shared/api/stations';
import { diffFields, insertRegisterChange } from '../audit/register-change.repository';
import type { Db, DbOrTrx } from '../db/database';
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

/** Adds a station, with its change log entry in the same transaction. */
export async function createStation(db: Db, input: StationInput, personId: string): Promise<StationSummary> {
  return db.transaction().execute(async (trx) => {
    const created = await stationsRepository.insertStation(trx, input).catch(uniqueViolation);
    await insertRegisterChange(trx, { personId, register: 'station', recordId: created.id, action: 'create', changes: diffFields({}, { ...input }) });
    return created;
  });
}

/** Edits a station at the version read; the fields that changed go in its change log, before and after, in the same transaction. */
export async function updateStation(db: Db, stationId: string, patch: StationPatch, personId: string): Promise<StationSummary> {
  const { version, ...fields } = patch;
  return db.transaction().execute(async (trx) => {
    const before = await getStation(trx, stationId);
    const updated = await stationsRepository.updateStation(trx, stationId, version, fields).catch(uniqueViolation);
    if (!updated) throw versionConflict('station', (await getStation(trx, stationId)).version);
    await insertRegisterChange(trx, { personId, register: 'station', recordId: stationId, action: 'edit', changes: diffFields({ ...before }, { ...fields }) });
    return updated;
  });
}
