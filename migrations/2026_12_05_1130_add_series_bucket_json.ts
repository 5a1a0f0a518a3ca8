import { type Kysely, sql } from 'kysely';

/**
 * Each stored hour and day keeps its answer's JSON text (server/series/bucket-json.ts), written with the
 * aggregates, so long ranges are answered by joining text. Existing rows are filled with the expression as it
 * stands at this migration.
 */
const TAIL = sql`concat(
  '"time":"', to_char(bucket_start at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"'),
  '","meanHpa":', mean_hpa, ',"minHpa":', min_hpa, ',"maxHpa":', max_hpa, ',"count":', point_count,
  ',"flaggedShare":', case when point_count = 0 then 0 else flagged_count::float8 / point_count end,
  ',"uncertaintyHpa":', coalesce(mean_uncertainty_hpa::text, 'null'), '}')`;

export async function up(db: Kysely<any>): Promise<void> {
  for (const table of ['station_series_hourly', 'station_series_daily']) {
    await db.schema.alterTable(table).addColumn('bucket_json', 'text').execute();
    await sql`update ${sql.table(table)} set bucket_json = ${TAIL}`.execute(db);
    await db.schema.alterTable(table).alterColumn('bucket_json', (c) => c.setNotNull()).execute();
  }
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of ['station_series_hourly', 'station_series_daily']) {
    await db.schema.alterTable(table).dropColumn('bucket_json').execute();
  }
}
