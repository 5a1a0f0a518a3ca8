import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('pin_set')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('scan_id', 'uuid', (c) => c.notNull().references('scan.id').onDelete('cascade'))
    .addColumn('created_by', 'uuid', (c) => c.notNull().references('person.id'))
    .addColumn('pins', 'jsonb', (c) => c.notNull())
    .addColumn('model', 'text', (c) => c.notNull())
    .addColumn('rms_hpa', 'double precision', (c) => c.notNull())
    .addColumn('rms_minutes', 'double precision', (c) => c.notNull())
    .addColumn('fit', 'jsonb', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('pin_set_scan_idx').on('pin_set').column('scan_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('pin_set').execute();
}
