import type { Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('chart_form').addColumn('version', 'integer', (c) => c.notNull().defaultTo(1)).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('chart_form').dropColumn('version').execute();
}
