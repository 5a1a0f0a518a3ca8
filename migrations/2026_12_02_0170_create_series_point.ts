import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('series_point')
    .addColumn('ink_line_id', 'uuid', (c) => c.notNull().references('ink_line.id').onDelete('cascade'))
    .addColumn('station_id', 'uuid', (c) => c.notNull().references('station.id'))
    .addColumn('time', 'timestamptz', (c) => c.notNull())
    .addColumn('pressure_hpa', 'double precision')
    .addColumn('uncertainty_hpa', 'double precision')
    .addColumn('flag', 'text', (c) => c.notNull().check(sql`flag in ('ok', 'interpolated', 'gap', 'off_scale', 'suspect')`))
    .addPrimaryKeyConstraint('series_point_pk', ['ink_line_id', 'time'])
    .execute();
  // Every series query is one station over a time range, read in time order.
  await db.schema.createIndex('series_point_station_time_idx').on('series_point').columns(['station_id', 'time']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('series_point').execute();
}
