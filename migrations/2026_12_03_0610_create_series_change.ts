import { type Kysely, sql } from 'kysely';

/** What entered or left a station series, by whom and why: the record behind every series version. */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('series_change')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('station_id', 'uuid', (c) => c.notNull().references('station.id').onDelete('cascade'))
    .addColumn('ink_line_id', 'uuid', (c) => c.references('ink_line.id').onDelete('set null'))
    .addColumn('change', 'text', (c) => c.notNull().check(sql`change in ('added', 'removed')`))
    .addColumn('person_id', 'uuid', (c) => c.references('person.id'))
    .addColumn('reason', 'text', (c) => c.notNull())
    .addColumn('at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('series_change_station_idx').on('series_change').columns(['station_id', 'id']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('series_change').execute();
}
