import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('instrument')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('station_id', 'uuid', (c) => c.notNull().references('station.id'))
    .addColumn('serial', 'text', (c) => c.notNull())
    .addColumn('maker', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('installed_on', 'date')
    .addColumn('removed_on', 'date')
    .addColumn('notes', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('instrument_dates_check', sql`removed_on is null or installed_on is null or removed_on >= installed_on`)
    .execute();
  await db.schema.createIndex('instrument_station_idx').on('instrument').column('station_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('instrument').execute();
}
