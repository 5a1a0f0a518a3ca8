import { type Kysely, sql } from 'kysely';

/** Counts and pages under a date range read span_start/span_end from this b-tree (see scan-filters.ts). */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index scan_span_start_end_idx on scan (span_start, span_end)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex('scan_span_start_end_idx').ifExists().execute();
}
