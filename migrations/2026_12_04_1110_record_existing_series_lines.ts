import { type Kysely, sql } from 'kysely';

/**
 * Every ink line already in a station series before the series was materialized gets its `added` record,
 * so the first build of each station reads them like any later change. Which lines count is the predicate
 * of server/series/series-lines.ts at the time of this migration: handed in or approved.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    insert into series_change (station_id, ink_line_id, change, person_id, reason)
    select distinct p.station_id, l.id, 'added', null::uuid, 'in the series before it was materialized'
    from ink_line l join series_point p on p.ink_line_id = l.id
    where l.status in ('handed_in', 'approved')`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`delete from series_change where reason = 'in the series before it was materialized'`.execute(db);
}
