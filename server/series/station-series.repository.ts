import { sql } from 'kysely';
import type { SeriesPoint } from '@shared/api/series';
import type { DbOrTrx } from '../db/database';
import { BUCKET_JSON_TAIL } from './bucket-json';

/** A time span, inclusive at both ends, UTC epoch ms. */
export interface TimeSpan {
  fromMs: number;
  toMs: number;
}

export interface SeriesState {
  version: number;
  builtAt: Date | null;
  lastChangeId: number;
}

export interface PendingChange {
  id: number;
  inkLineId: string | null;
}

const MS_PER_HOUR = 3_600_000;
const MS_PER_DAY = 86_400_000;
// Buckets start on whole UTC hours and days: date_bin from the Unix epoch (PostgreSQL 14+).
const EPOCH = sql`timestamptz '1970-01-01 00:00:00+00'`;

/** The station's state row, created at version 0 if missing, locked for the rest of the transaction. */
export async function lockState(trx: DbOrTrx, stationId: string): Promise<SeriesState> {
  await trx.insertInto('station_series_state').values({ station_id: stationId }).onConflict((oc) => oc.column('station_id').doNothing()).execute();
  const row = await trx
    .selectFrom('station_series_state')
    .select(['version', 'built_at', 'last_change_id'])
    .where('station_id', '=', stationId)
    .forUpdate()
    .executeTakeFirstOrThrow();
  return { version: row.version, builtAt: row.built_at, lastChangeId: Number(row.last_change_id) };
}

export async function saveState(trx: DbOrTrx, stationId: string, state: { version: number; lastChangeId: number }): Promise<void> {
  await trx
    .updateTable('station_series_state')
    .set({ version: state.version, last_change_id: state.lastChangeId, built_at: sql<Date>`now()` })
    .where('station_id', '=', stationId)
    .execute();
}

/** The station's version and build time without locking; version 0 and null before its first build. */
export async function findState(db: DbOrTrx, stationId: string): Promise<{ version: number; builtAt: Date | null; hasPendingChanges: boolean }> {
  const row = await db
    .selectFrom('station as st')
    .leftJoin('station_series_state as s', 's.station_id', 'st.id')
    .select(['s.version', 's.built_at'])
    .select((eb) =>
      eb
        .exists(
          eb
            .selectFrom('series_change as c')
            .select('c.id')
            .whereRef('c.station_id', '=', 'st.id')
            .where(sql<boolean>`c.id > coalesce(s.last_change_id, 0)`),
        )
        .as('has_pending'),
    )
    .where('st.id', '=', stationId)
    .executeTakeFirst();
  return { version: row?.version ?? 0, builtAt: row?.built_at ?? null, hasPendingChanges: Boolean(row?.has_pending) };
}

export async function findChangesAfter(trx: DbOrTrx, stationId: string, afterId: number): Promise<PendingChange[]> {
  const rows = await trx
    .selectFrom('series_change')
    .select(['id', 'ink_line_id'])
    .where('station_id', '=', stationId)
    .where('id', '>', String(afterId))
    .orderBy('id')
    .execute();
  return rows.map((row) => ({ id: Number(row.id), inkLineId: row.ink_line_id }));
}

/** Stations whose series_change rows run past their build cursor. */
export async function findStationsWithPendingChanges(db: DbOrTrx): Promise<string[]> {
  const rows = await db
    .selectFrom('series_change as c')
    .leftJoin('station_series_state as s', 's.station_id', 'c.station_id')
    .select('c.station_id')
    .where(sql<boolean>`c.id > coalesce(s.last_change_id, 0)`)
    .distinct()
    .execute();
  return rows.map((row) => row.station_id);
}

type SpanRow = { from_time: Date | null; to_time: Date | null };

function toSpans(rows: SpanRow[]): TimeSpan[] {
  return rows.flatMap((row) => (row.from_time && row.to_time ? [{ fromMs: new Date(row.from_time).getTime(), toMs: new Date(row.to_time).getTime() }] : []));
}

/**
 * Per ink line: where it has stored points, and where the series now shows its points (which differ when
 * the line's points were replaced). Both can change when the line enters or leaves.
 */
export async function findSpansOfInkLines(trx: DbOrTrx, stationId: string, inkLineIds: readonly string[]): Promise<TimeSpan[]> {
  if (inkLineIds.length === 0) return [];
  const stored = await trx
    .selectFrom('series_point')
    .select((eb) => [eb.fn.min('time').as('from_time'), eb.fn.max('time').as('to_time')])
    .where('ink_line_id', 'in', inkLineIds)
    .where('station_id', '=', stationId)
    .groupBy('ink_line_id')
    .execute();
  const shown = await trx
    .selectFrom('station_series_point')
    .select((eb) => [eb.fn.min('time').as('from_time'), eb.fn.max('time').as('to_time')])
    .where('ink_line_id', 'in', inkLineIds)
    .where('station_id', '=', stationId)
    .groupBy('ink_line_id')
    .execute();
  return [...toSpans(stored as SpanRow[]), ...toSpans(shown as SpanRow[])];
}

/** All of the station's stored and shown points, as one span (none when it has neither). */
export async function findWholeStationSpan(trx: DbOrTrx, stationId: string): Promise<TimeSpan[]> {
  const { rows } = await sql<SpanRow>`
    select min(t) as from_time, max(t) as to_time from (
      select time as t from series_point where station_id = ${stationId}
      union all select time from station_series_point where station_id = ${stationId}) times`.execute(trx);
  return toSpans(rows);
}

export async function deletePoints(trx: DbOrTrx, stationId: string, span: TimeSpan): Promise<void> {
  await trx
    .deleteFrom('station_series_point')
    .where('station_id', '=', stationId)
    .where('time', '>=', new Date(span.fromMs))
    .where('time', '<=', new Date(span.toMs))
    .execute();
}

/** One insert per batch through unnest: five array parameters instead of six per row. */
export async function insertPoints(trx: DbOrTrx, stationId: string, points: readonly SeriesPoint[]): Promise<void> {
  if (points.length === 0) return;
  await sql`
    insert into station_series_point (station_id, time, pressure_hpa, uncertainty_hpa, flag, ink_line_id)
    select ${stationId}::uuid, * from unnest(
      ${points.map((point) => point.time)}::timestamptz[],
      ${points.map((point) => point.pressureHpa)}::float8[],
      ${points.map((point) => point.uncertaintyHpa)}::float8[],
      ${points.map((point) => point.flag)}::text[],
      ${points.map((point) => point.inkLineId)}::uuid[])`.execute(trx);
}

/** Recomputes the hours and UTC days that touch the span from the materialized points. */
export async function rebuildAggregates(trx: DbOrTrx, stationId: string, span: TimeSpan): Promise<void> {
  const buckets = [
    { table: 'station_series_hourly', bucketMs: MS_PER_HOUR, width: sql`interval '1 hour'` },
    { table: 'station_series_daily', bucketMs: MS_PER_DAY, width: sql`interval '1 day'` },
  ] as const;
  for (const bucket of buckets) {
    const from = new Date(Math.floor(span.fromMs / bucket.bucketMs) * bucket.bucketMs);
    const toExclusive = new Date((Math.floor(span.toMs / bucket.bucketMs) + 1) * bucket.bucketMs);
    await sql`delete from ${sql.table(bucket.table)} where station_id = ${stationId} and bucket_start >= ${from} and bucket_start < ${toExclusive}`.execute(trx);
    await sql`
      insert into ${sql.table(bucket.table)} (station_id, bucket_start, mean_hpa, min_hpa, max_hpa, point_count, flagged_count, mean_uncertainty_hpa, bucket_json)
      select station_id, bucket_start, mean_hpa, min_hpa, max_hpa, point_count, flagged_count, mean_uncertainty_hpa, ${BUCKET_JSON_TAIL}
      from (
        select station_id, date_bin(${bucket.width}, time, ${EPOCH}) as bucket_start, avg(pressure_hpa) as mean_hpa,
               min(pressure_hpa) as min_hpa, max(pressure_hpa) as max_hpa, count(*)::int as point_count,
               (count(*) filter (where flag <> 'ok'))::int as flagged_count, avg(uncertainty_hpa) as mean_uncertainty_hpa
        from station_series_point
        where station_id = ${stationId} and time >= ${from} and time < ${toExclusive}
        group by 1, 2) grouped`.execute(trx);
  }
}
