import { type Kysely, sql } from 'kysely';

/** The scan's change log also records review decisions on its ink lines (action 'review'). */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table scan_audit drop constraint if exists scan_audit_action_check`.execute(db);
  await sql`alter table scan_audit add constraint scan_audit_action_check check (action in ('upload', 'edit', 'status', 'inventory', 'review'))`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`delete from scan_audit where action = 'review'`.execute(db);
  await sql`alter table scan_audit drop constraint if exists scan_audit_action_check`.execute(db);
  await sql`alter table scan_audit add constraint scan_audit_action_check check (action in ('upload', 'edit', 'status', 'inventory'))`.execute(db);
}
