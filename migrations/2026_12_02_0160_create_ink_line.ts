import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('ink_line')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('scan_id', 'uuid', (c) => c.notNull().references('scan.id').onDelete('cascade'))
    .addColumn('pin_set_id', 'uuid', (c) => c.notNull().references('pin_set.id'))
    .addColumn('author_id', 'uuid', (c) => c.notNull().references('person.id'))
    .addColumn('status', 'text', (c) => c.notNull().check(sql`status in ('draft', 'handed_in', 'approved', 'returned')`))
    // Bumped on every update so that two editors cannot silently overwrite each other.
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('knots', 'jsonb', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('ink_line_scan_idx').on('ink_line').column('scan_id').execute();
  await db.schema.createIndex('ink_line_author_status_idx').on('ink_line').columns(['author_id', 'status']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('ink_line').execute();
}
