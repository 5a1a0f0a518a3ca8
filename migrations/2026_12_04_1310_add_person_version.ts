import type { Kysely } from 'kysely';

/** Optimistic version of a person's roles, name and enabled state: two admins editing at once do not overwrite each other. */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('person').addColumn('version', 'integer', (c) => c.notNull().defaultTo(1)).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('person').dropColumn('version').execute();
}
