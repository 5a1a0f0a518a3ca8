import type { PageQuery } from '@shared/api/paging';
import type { StationSortKey, StationSummary } from '@shared/api/stations';
import type { DbOrTrx } from '../db/database';
import type { StationTable } from './station.table';

const SORT_COLUMNS = { name: 'name', code: 'code' } as const;

function toStationSummary(row: Omit<StationTable, 'created_at' | 'id'> & { id: string }): StationSummary {
  return {
    id: row.id,
    code: row.code,
    name: row.name,
    latitude: row.latitude,
    longitude: row.longitude,
    elevationM: row.elevation_m,
    timeZone: row.time_zone,
  };
}

const COLUMNS = ['id', 'code', 'name', 'latitude', 'longitude', 'elevation_m', 'time_zone'] as const;

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

export async function insertStation(db: DbOrTrx, station: Omit<StationSummary, 'id'>): Promise<StationSummary> {
  const row = await db
    .insertInto('station')
    .values({
      code: station.code,
      name: station.name,
      latitude: station.latitude,
      longitude: station.longitude,
      elevation_m: station.elevationM,
      time_zone: station.timeZone,
    })
    .returning(COLUMNS)
    .executeTakeFirstOrThrow();
  return toStationSummary(row);
}
