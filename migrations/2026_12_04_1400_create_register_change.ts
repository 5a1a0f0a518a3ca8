import { type Kysely, sql } from 'kysely';

/** The registers' change log (issue 13 finding 7): edits to stations, instruments and chart forms, and second hand-ins of an ink line. */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('register_change')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('person_id', 'uuid', (c) => c.notNull().references('person.id'))
    // station | instrument | chart_form | ink_line, and the id of the record in it (no foreign key: one column serves four tables).
    .addColumn('register', 'text', (c) => c.notNull().check(sql`register in ('station', 'instrument', 'chart_form', 'ink_line')`))
    .addColumn('record_id', 'uuid', (c) => c.notNull())
    .addColumn('action', 'text', (c) => c.notNull().check(sql`action in ('create', 'edit', 'hand_in_again')`))
    // { field: { before, after } }
    .addColumn('changes', 'jsonb', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('register_change_record_at').on('register_change').columns(['register', 'record_id', 'at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('register_change').execute();
}
