import { type Kysely, sql } from 'kysely';

/** Every archivist decision on an ink line (approve or return, with its note): the line's review history. */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('ink_line_review')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('ink_line_id', 'uuid', (c) => c.notNull().references('ink_line.id').onDelete('cascade'))
    .addColumn('decision', 'text', (c) => c.notNull().check(sql`decision in ('approved', 'returned')`))
    .addColumn('note', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('person_id', 'uuid', (c) => c.notNull().references('person.id'))
    .addColumn('at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('ink_line_review_line_idx').on('ink_line_review').columns(['ink_line_id', 'id']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('ink_line_review').execute();
}
