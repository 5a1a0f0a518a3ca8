import { type Kysely, sql } from 'kysely';

/**
 * The date-range filter reads the longest chart span (max of span_end − span_start) from an index, and
 * bounds span_start on both sides; the GiST range index it replaces gave the planner fixed row guesses
 * that sent wide ranges down the wrong plan (scripts/bench-catalogue.ts). Counts per chart form or station
 * and status read from the two composite indexes.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index scan_span_length_idx on scan ((span_end - span_start))`.execute(db);
  await sql`drop index scan_span_idx`.execute(db);
  await sql`create index scan_chart_form_status_idx on scan (chart_form_id, status)`.execute(db);
  await sql`create index scan_station_status_idx on scan (station_id, status)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`create index scan_span_idx on scan using gist (tstzrange(span_start, span_end, '[]')) where span_start is not null`.execute(db);
  for (const index of ['scan_span_length_idx', 'scan_chart_form_status_idx', 'scan_station_status_idx']) await db.schema.dropIndex(index).ifExists().execute();
}
