import { type Kysely, sql } from 'kysely';

/**
 * The materialized station series: one merged point per station and time, hourly and daily aggregates
 * beside it, and one state row per station with the series version, when it was built and how far through
 * series_change the build has read (the cursor). Rebuilt span by span by the series job (server/series).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('station_series_point')
    .addColumn('station_id', 'uuid', (c) => c.notNull().references('station.id').onDelete('cascade'))
    .addColumn('time', 'timestamptz', (c) => c.notNull())
    .addColumn('pressure_hpa', 'double precision', (c) => c.notNull())
    .addColumn('uncertainty_hpa', 'double precision')
    .addColumn('flag', 'text', (c) => c.notNull().check(sql`flag in ('ok', 'interpolated', 'gap', 'off_scale', 'suspect')`))
    // No foreign key: a rebuild replaces the row when its ink line leaves; a deleted line leaves through series_change.
    .addColumn('ink_line_id', 'uuid', (c) => c.notNull())
    .addPrimaryKeyConstraint('station_series_point_pk', ['station_id', 'time'])
    .execute();
  // A rebuild finds where the series shows a changed ink line's points.
  await db.schema.createIndex('station_series_point_ink_line_idx').on('station_series_point').columns(['ink_line_id', 'time']).execute();
  for (const table of ['station_series_hourly', 'station_series_daily']) {
    await db.schema
      .createTable(table)
      .addColumn('station_id', 'uuid', (c) => c.notNull().references('station.id').onDelete('cascade'))
      .addColumn('bucket_start', 'timestamptz', (c) => c.notNull())
      .addColumn('mean_hpa', 'double precision', (c) => c.notNull())
      .addColumn('min_hpa', 'double precision', (c) => c.notNull())
      .addColumn('max_hpa', 'double precision', (c) => c.notNull())
      .addColumn('point_count', 'integer', (c) => c.notNull())
      .addColumn('flagged_count', 'integer', (c) => c.notNull())
      .addColumn('mean_uncertainty_hpa', 'double precision')
      .addPrimaryKeyConstraint(`${table}_pk`, ['station_id', 'bucket_start'])
      .execute();
  }
  await db.schema
    .createTable('station_series_state')
    .addColumn('station_id', 'uuid', (c) => c.primaryKey().references('station.id').onDelete('cascade'))
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('built_at', 'timestamptz')
    .addColumn('last_change_id', 'bigint', (c) => c.notNull().defaultTo(0))
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ['station_series_state', 'station_series_daily', 'station_series_hourly', 'station_series_point']) {
    await db.schema.dropTable(table).execute();
  }
}
