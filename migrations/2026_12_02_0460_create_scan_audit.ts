import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('scan_audit')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('scan_id', 'uuid', (c) => c.notNull().references('scan.id').onDelete('cascade'))
    .addColumn('person_id', 'uuid', (c) => c.notNull().references('person.id'))
    .addColumn('at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('action', 'text', (c) => c.notNull().check(sql`action in ('upload', 'edit', 'status', 'inventory')`))
    // { field: { before, after } }
    .addColumn('changes', 'jsonb', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('scan_audit_scan_at_idx').on('scan_audit').columns(['scan_id', 'at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('scan_audit').execute();
}
