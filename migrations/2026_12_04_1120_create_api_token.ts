import { type Kysely, sql } from 'kysely';

/** Personal read-only API tokens: only the SHA-256 of each token is kept; the token itself is shown once. */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('api_token')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('person_id', 'uuid', (c) => c.notNull().references('person.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('token_sha256', 'text', (c) => c.notNull().unique())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('last_used_at', 'timestamptz')
    .addColumn('revoked_at', 'timestamptz')
    .execute();
  await db.schema.createIndex('api_token_person_idx').on('api_token').columns(['person_id', 'created_at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('api_token').execute();
}
