import type { InstrumentInput, InstrumentSortKey, InstrumentSummary } from '@shared/api/instruments';
import type { PageQuery } from '@shared/api/paging';
import type { Selectable, Updateable } from 'kysely';
import type { DbOrTrx } from '../db/database';
import type { InstrumentTable } from './instrument.table';

const SORT_COLUMNS = { serial: 'serial', installedOn: 'installed_on' } as const;
const COLUMNS = ['id', 'station_id', 'serial', 'maker', 'installed_on', 'removed_on', 'notes', 'version'] as const;

function toInstrumentSummary(row: Pick<Selectable<InstrumentTable>, (typeof COLUMNS)[number]>): InstrumentSummary {
  return {
    id: row.id,
    stationId: row.station_id,
    serial: row.serial,
    maker: row.maker,
    installedOn: row.installed_on,
    removedOn: row.removed_on,
    notes: row.notes,
    version: row.version,
  };
}

function toColumns(input: Partial<InstrumentInput>): Updateable<InstrumentTable> {
  const columns: Updateable<InstrumentTable> = {};
  if (input.serial !== undefined) columns.serial = input.serial;
  if (input.maker !== undefined) columns.maker = input.maker;
  if (input.installedOn !== undefined) columns.installed_on = input.installedOn;
  if (input.removedOn !== undefined) columns.removed_on = input.removedOn;
  if (input.notes !== undefined) columns.notes = input.notes;
  return columns;
}

export async function listInstruments(
  db: DbOrTrx,
  stationId: string,
  query: PageQuery<InstrumentSortKey>,
): Promise<{ items: InstrumentSummary[]; total: number }> {
  const rows = await db
    .selectFrom('instrument')
    .select(COLUMNS)
    .where('station_id', '=', stationId)
    .orderBy(SORT_COLUMNS[query.sort ?? 'serial'], query.direction)
    .orderBy('id')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await db
    .selectFrom('instrument')
    .select((eb) => eb.fn.countAll<number>().as('total'))
    .where('station_id', '=', stationId)
    .executeTakeFirstOrThrow();
  return { items: rows.map(toInstrumentSummary), total };
}

export async function findInstrumentById(db: DbOrTrx, instrumentId: string): Promise<InstrumentSummary | undefined> {
  const row = await db.selectFrom('instrument').select(COLUMNS).where('id', '=', instrumentId).executeTakeFirst();
  return row ? toInstrumentSummary(row) : undefined;
}

export async function insertInstrument(db: DbOrTrx, stationId: string, input: InstrumentInput): Promise<InstrumentSummary> {
  const row = await db
    .insertInto('instrument')
    .values({
      station_id: stationId,
      serial: input.serial,
      maker: input.maker,
      installed_on: input.installedOn,
      removed_on: input.removedOn,
      notes: input.notes,
    })
    .returning(COLUMNS)
    .executeTakeFirstOrThrow();
  return toInstrumentSummary(row);
}

/** Applies a patch only when the row is still at `version`; undefined otherwise. */
export async function updateInstrument(
  db: DbOrTrx,
  instrumentId: string,
  version: number,
  patch: Partial<InstrumentInput>,
): Promise<InstrumentSummary | undefined> {
  const row = await db
    .updateTable('instrument')
    .set({ ...toColumns(patch), version: (eb) => eb('version', '+', 1) })
    .where('id', '=', instrumentId)
    .where('version', '=', version)
    .returning(COLUMNS)
    .executeTakeFirst();
  return row ? toInstrumentSummary(row) : undefined;
}
