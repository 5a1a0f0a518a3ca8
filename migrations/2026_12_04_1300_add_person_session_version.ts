import { type Kysely, sql } from 'kysely';

/**
 * Each token carries the person's session version (`sv`); bumping it ends every session at once
 * (role change, disabling, password change, sign out everywhere). A disabled person cannot sign in.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('person')
    .addColumn('session_version', 'integer', (c) => c.notNull().defaultTo(1))
    .addColumn('disabled_at', 'timestamptz')
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('person').dropColumn('session_version').dropColumn('disabled_at').dropColumn('updated_at').execute();
}
