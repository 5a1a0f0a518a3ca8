import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  // One row per named seed that has run, so that seeding is done once and never repeated.
  await db.schema
    .createTable('demo_seed')
    .addColumn('name', 'text', (c) => c.primaryKey())
    .addColumn('seeded_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('demo_seed').execute();
}
