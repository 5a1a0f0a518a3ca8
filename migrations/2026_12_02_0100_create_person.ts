import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('person')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('display_name', 'text', (c) => c.notNull())
    .addColumn('password_hash', 'text', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  // E-mail addresses are matched case-insensitively at sign-in, so uniqueness must be too.
  await db.schema.createIndex('person_email_unique').on('person').expression(sql`lower(email)`).unique().execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('person').execute();
}
