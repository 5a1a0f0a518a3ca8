import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('invitation')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('roles', sql`text[]`, (c) => c.notNull())
    // SHA-256 of the link's secret (32 random bytes): a copy of the table opens no account.
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('invited_by', 'uuid', (c) => c.references('person.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('sent_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('accepted_at', 'timestamptz')
    .addColumn('withdrawn_at', 'timestamptz')
    .addColumn('person_id', 'uuid', (c) => c.references('person.id').onDelete('set null'))
    .execute();
  // At most one open invitation per address (case-insensitive).
  await sql`create unique index invitation_open_email on invitation (lower(email)) where accepted_at is null and withdrawn_at is null`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('invitation').execute();
}
