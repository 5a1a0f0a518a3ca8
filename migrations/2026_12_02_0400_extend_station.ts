import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('station')
    .addColumn('wigos_id', 'text')
    .addColumn('barometer_height_m', 'double precision')
    .addColumn('time_standard', 'text', (c) => c.notNull().defaultTo('local_standard').check(sql`time_standard in ('local_standard', 'utc')`))
    .addColumn('history_notes', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .execute();
  // A WIGOS identifier names one station worldwide.
  await sql`create unique index station_wigos_id_key on station (wigos_id) where wigos_id is not null`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index station_wigos_id_key`.execute(db);
  await db.schema
    .alterTable('station')
    .dropColumn('wigos_id')
    .dropColumn('barometer_height_m')
    .dropColumn('time_standard')
    .dropColumn('history_notes')
    .dropColumn('version')
    .execute();
}
