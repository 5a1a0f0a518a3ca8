import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('people_change')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    // Who made the change; null when nobody was signed in (a password reset by mail).
    .addColumn('actor_id', 'uuid', (c) => c.references('person.id').onDelete('set null'))
    .addColumn('person_id', 'uuid', (c) => c.references('person.id').onDelete('set null'))
    .addColumn('invitation_id', 'uuid', (c) => c.references('invitation.id').onDelete('set null'))
    // The e-mail of the person or invitation at the time, so the entry reads even after a removal.
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('action', 'text', (c) => c.notNull())
    // { field: { before, after } }
    .addColumn('changes', 'jsonb', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('people_change_at').on('people_change').columns(['at', 'id']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('people_change').execute();
}
