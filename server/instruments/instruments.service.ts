import { checkInstrumentDates, type InstrumentInput, type InstrumentPatch, type InstrumentSortKey, type InstrumentSummary } from '@shared/api/instruments';
import type { Page, PageQuery } from '@shared/api/paging';
import { diffFields, insertRegisterChange } from '../audit/register-change.repository';
import type { Db, DbOrTrx } from '../db/database';
import { PG_CHECK_VIOLATION, pgErrorCode } from '../db/pg-errors';
import { AppError, HTTP, validationFailed } from '../errors/app-error';
import { versionConflict } from '../http/version-conflict';
import * as stationsService from '../stations/stations.service';
import * as instrumentsRepository from './instruments.repository';

export async function listInstruments(db: DbOrTrx, stationId: string, query: PageQuery<InstrumentSortKey>): Promise<Page<InstrumentSummary>> {
  await stationsService.getStation(db, stationId);
  const { items, total } = await instrumentsRepository.listInstruments(db, stationId, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

/** The instrument, or 404 instrument_not_found. */
export async function getInstrument(db: DbOrTrx, instrumentId: string): Promise<InstrumentSummary> {
  const instrument = await instrumentsRepository.findInstrumentById(db, instrumentId);
  if (!instrument) throw new AppError(HTTP.notFound, 'instrument_not_found', 'There is no instrument with this id.');
  return instrument;
}

/** Adds an instrument to a station, with its change log entry in the same transaction. */
export async function createInstrument(db: Db, stationId: string, input: InstrumentInput, personId: string): Promise<InstrumentSummary> {
  return db.transaction().execute(async (trx) => {
    await stationsService.getStation(trx, stationId);
    const created = await instrumentsRepository.insertInstrument(trx, stationId, input);
    await insertRegisterChange(trx, { personId, register: 'instrument', recordId: created.id, action: 'create', changes: diffFields({}, { stationId, ...input }) });
    return created;
  });
}

/** Edits an instrument at the version read; the fields that changed go in its change log in the same transaction. */
export async function updateInstrument(db: Db, instrumentId: string, patch: InstrumentPatch, personId: string): Promise<InstrumentSummary> {
  return db.transaction().execute(async (trx) => {
    const updated = await updateInstrumentRow(trx, instrumentId, patch);
    await insertRegisterChange(trx, { personId, register: 'instrument', recordId: instrumentId, action: 'edit', changes: updated.changes });
    return updated.instrument;
  });
}

async function updateInstrumentRow(db: DbOrTrx, instrumentId: string, patch: InstrumentPatch): Promise<{ instrument: InstrumentSummary; changes: ReturnType<typeof diffFields> }> {
  const { version, ...fields } = patch;
  const current = await getInstrument(db, instrumentId);
  const dateProblem = checkInstrumentDates(
    fields.installedOn !== undefined ? fields.installedOn : current.installedOn,
    fields.removedOn !== undefined ? fields.removedOn : current.removedOn,
  );
  if (dateProblem) throw validationFailed({ removedOn: dateProblem }, 'The instrument has invalid fields.');
  const updated = await instrumentsRepository.updateInstrument(db, instrumentId, version, fields).catch((error: unknown) => {
    // The dates changed between the read above and this write.
    if (pgErrorCode(error) === PG_CHECK_VIOLATION) throw validationFailed({ removedOn: 'removedOn must not be before installedOn' });
    throw error;
  });
  if (updated) return { instrument: updated, changes: diffFields({ ...current }, { ...fields }) };
  throw versionConflict('instrument', (await getInstrument(db, instrumentId)).version);
}
