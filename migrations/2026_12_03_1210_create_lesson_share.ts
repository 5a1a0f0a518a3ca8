import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('lesson_share')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('lesson_id', 'uuid', (c) => c.notNull().references('lesson.id').onDelete('cascade'))
    // 32 random bytes, base64url: the only secret of a share link.
    .addColumn('token', 'text', (c) => c.notNull().unique())
    .addColumn('created_by', 'uuid', (c) => c.notNull().references('person.id').onDelete('cascade'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('expires_at', 'timestamptz')
    .addColumn('revoked_at', 'timestamptz')
    .addColumn('open_count', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('last_opened_at', 'timestamptz')
    .execute();
  await db.schema.createIndex('lesson_share_lesson').on('lesson_share').column('lesson_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('lesson_share').execute();
}
