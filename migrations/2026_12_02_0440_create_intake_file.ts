import { type Kysely, sql } from 'kysely';

/** One row per file sent to a batch, whatever became of it, so the batch summary can list rejected files too. */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('intake_file')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('batch_id', 'uuid', (c) => c.notNull().references('intake_batch.id').onDelete('cascade'))
    .addColumn('file_name', 'text', (c) => c.notNull())
    .addColumn('outcome', 'text', (c) => c.notNull().check(sql`outcome in ('stored', 'duplicate', 'rejected')`))
    .addColumn('reason', 'text')
    .addColumn('code', 'text')
    .addColumn('scan_ids', sql`uuid[]`, (c) => c.notNull().defaultTo(sql`'{}'`))
    .addColumn('at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('intake_file_batch_idx').on('intake_file').columns(['batch_id', 'at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('intake_file').execute();
}
