import { type Kysely, sql } from 'kysely';

/**
 * The catalogue sorts by period (either way, scans without one last) then id, and by upload time; these
 * indexes give those orders without sorting every match (measured by scripts/bench-catalogue.ts).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index scan_period_id_idx on scan (period_start asc nulls last, id)`.execute(db);
  await sql`create index scan_period_desc_id_idx on scan (period_start desc nulls last, id)`.execute(db);
  await sql`create index scan_status_period_id_idx on scan (status, period_start asc nulls last, id)`.execute(db);
  await sql`create index scan_uploaded_at_idx on scan (uploaded_at, id)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const index of ['scan_period_id_idx', 'scan_period_desc_id_idx', 'scan_status_period_id_idx', 'scan_uploaded_at_idx']) {
    await db.schema.dropIndex(index).ifExists().execute();
  }
}
