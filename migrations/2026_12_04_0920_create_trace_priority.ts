import { type Kysely, sql } from 'kysely';

/**
 * Priorities the archivist sets for the Desk's queue, per station, per box (collection + box) or per scan.
 * `scope_key` is the station id, `collection/box`, or the scan id; a scan's priority is the highest that applies.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('trace_priority')
    .addColumn('scope', 'text', (c) => c.notNull().check(sql`scope in ('station', 'box', 'scan')`))
    .addColumn('scope_key', 'text', (c) => c.notNull())
    .addColumn('priority', 'integer', (c) => c.notNull())
    .addColumn('set_by', 'uuid', (c) => c.references('person.id').onDelete('set null'))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint('trace_priority_pk', ['scope', 'scope_key'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('trace_priority').execute();
}
