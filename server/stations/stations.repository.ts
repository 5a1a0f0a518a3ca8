import type { PageQuery } from '@shared/api/paging';
import type { StationInput, StationSortKey, StationSummary } from '@shared/api/stations';
import type { Selectable, Updateable } from 'kysely';
import type { DbOrTrx } from '../db/database';
import type { StationTable } from './station.table';

const SORT_COLUMNS = { name: 'name', code: 'code' } as const;

const COLUMNS = [
  'id',
  'code',
  'name',
  'latitude',
  'longitude',
  'elevation_m',
  'time_zone',
  'wigos_id',
  'barometer_height_m',
  'time_standard',
  'history_notes',
  'version',
] as const;

type StationRow = Pick<Selectable<StationTable>, (typeof COLUMNS)[number]>;

function toStationSummary(row: StationRow): StationSummary {
  return {
    id: row.id,
    code: row.code,
    name: row.name,
    latitude: row.latitude,
    longitude: row.longitude,
    elevationM: row.elevation_m,
    timeZone: row.time_zone,
    wigosId: row.wigos_id,
    barometerHeightM: row.barometer_height_m,
    timeStandard: row.time_standard,
    historyNotes: row.history_notes,
    version: row.version,
  };
}

/** StationInput fields → columns; absent fields are left out (a PATCH changes only what it names). */
function toColumns(input: Partial<StationInput>): Updateable<StationTable> {
  const columns: Updateable<StationTable> = {};
  if (input.code !== undefined) columns.code = input.code;
  if (input.name !== undefined) columns.name = input.name;
  if (input.latitude !== undefined) columns.latitude = input.latitude;
  if (input.longitude !== undefined) columns.longitude = input.longitude;
  if (input.elevationM !== undefined) columns.elevation_m = input.elevationM;
  if (input.timeZone !== undefined) columns.time_zone = input.timeZone;
  if (input.wigosId !== undefined) columns.wigos_id = input.wigosId;
  if (input.barometerHeightM !== undefined) columns.barometer_height_m = input.barometerHeightM;
  if (input.timeStandard !== undefined) columns.time_standard = input.timeStandard;
  if (input.historyNotes !== undefined) columns.history_notes = input.historyNotes;
  return columns;
}

export async function listStations(db: DbOrTrx, query: PageQuery<StationSortKey>): Promise<{ items: StationSummary[]; total: number }> {
  const rows = await db
    .selectFrom('station')
    .select(COLUMNS)
    .orderBy(SORT_COLUMNS[query.sort ?? 'name'], query.direction)
    .orderBy('id')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await db.selectFrom('station').select((eb) => eb.fn.countAll<number>().as('total')).executeTakeFirstOrThrow();
  return { items: rows.map(toStationSummary), total };
}

export async function findStationById(db: DbOrTrx, stationId: string): Promise<StationSummary | undefined> {
  const row = await db.selectFrom('station').select(COLUMNS).where('id', '=', stationId).executeTakeFirst();
  return row ? toStationSummary(row) : undefined;
}

export async function findStationByCode(db: DbOrTrx, code: string): Promise<StationSummary | undefined> {
  const row = await db.selectFrom('station').select(COLUMNS).where('code', '=', code).executeTakeFirst();
  return row ? toStationSummary(row) : undefined;
}

/** Every station whose code or name (case-insensitive) is one of `keys`, for the inventory import. */
export async function findStationsByCodeOrName(db: DbOrTrx, keys: string[]): Promise<StationSummary[]> {
  if (keys.length === 0) return [];
  const lowered = keys.map((key) => key.toLowerCase());
  const rows = await db
    .selectFrom('station')
    .select(COLUMNS)
    .where((eb) => eb.or([eb(eb.fn('lower', ['code']), 'in', lowered), eb(eb.fn('lower', ['name']), 'in', lowered)]))
    .execute();
  return rows.map(toStationSummary);
}

export async function insertStation(db: DbOrTrx, station: Partial<StationInput> & Pick<StationInput, 'code' | 'name' | 'timeZone'>): Promise<StationSummary> {
  const row = await db
    .insertInto('station')
    .values({ latitude: null, longitude: null, elevation_m: null, ...toColumns(station) } as StationTable & { id?: never })
    .returning(COLUMNS)
    .executeTakeFirstOrThrow();
  return toStationSummary(row);
}

/** Applies a patch only when the row is still at `version`; undefined when it is not (or is gone). */
export async function updateStation(db: DbOrTrx, stationId: string, version: number, patch: Partial<StationInput>): Promise<StationSummary | undefined> {
  const row = await db
    .updateTable('station')
    .set({ ...toColumns(patch), version: (eb) => eb('version', '+', 1) })
    .where('id', '=', stationId)
    .where('version', '=', version)
    .returning(COLUMNS)
    .executeTakeFirst();
  return row ? toStationSummary(row) : undefined;
}
