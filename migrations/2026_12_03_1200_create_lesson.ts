import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('lesson')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('owner_id', 'uuid', (c) => c.notNull().references('person.id').onDelete('cascade'))
    .addColumn('station_id', 'uuid', (c) => c.notNull().references('station.id'))
    .addColumn('title', 'text', (c) => c.notNull())
    .addColumn('audience', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('description', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('passage_from', 'timestamptz', (c) => c.notNull())
    .addColumn('passage_to', 'timestamptz', (c) => c.notNull())
    // Front notes, questions and candidate decisions: edited together by one teacher under one version.
    .addColumn('notes', 'jsonb', (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn('questions', 'jsonb', (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn('candidate_decisions', 'jsonb', (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('copied_from_id', 'uuid', (c) => c.references('lesson.id').onDelete('set null'))
    .addColumn('version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('lesson_passage_order', sql`passage_from < passage_to`)
    .execute();
  await db.schema.createIndex('lesson_owner_updated').on('lesson').columns(['owner_id', 'updated_at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('lesson').execute();
}
