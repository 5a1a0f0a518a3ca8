import { type Kysely, sql } from 'kysely';

/** How many independent ink lines a station's charts need before they are approved (1, or 2 for a cross-trace). */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('station_tracing')
    .addColumn('station_id', 'uuid', (c) => c.primaryKey().references('station.id').onDelete('cascade'))
    .addColumn('ink_lines_required', 'integer', (c) => c.notNull().defaultTo(1).check(sql`ink_lines_required in (1, 2)`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('station_tracing').execute();
}
