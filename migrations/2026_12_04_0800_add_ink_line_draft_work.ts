import { type Kysely, sql } from 'kysely';

/**
 * Drafts on the server: an ink line exists from the volunteer's first pin, as a draft with no pin set yet, and
 * keeps the Bench's whole work (pins, knots with their spans, marks, readings, step) so it resumes as left.
 * At hand-in the row gets its pin set, its computed result and handed_in_at. One draft per volunteer per scan.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('ink_line').alterColumn('pin_set_id', (c) => c.dropNotNull()).execute();
  await db.schema
    .alterTable('ink_line')
    .addColumn('work', 'jsonb', (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    // What the hand-in computed (registration, corrections with their residuals, pipeline version); null for a draft never handed in.
    .addColumn('result', 'jsonb')
    .addColumn('handed_in_at', 'timestamptz')
    .execute();
  await db.schema
    .alterTable('ink_line')
    .addCheckConstraint('ink_line_pinned_unless_draft', sql`status = 'draft' or pin_set_id is not null`)
    .execute();
  await db.schema
    .createIndex('ink_line_one_draft_idx')
    .on('ink_line')
    .columns(['scan_id', 'author_id'])
    .unique()
    .where(sql.ref('status'), '=', 'draft')
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex('ink_line_one_draft_idx').execute();
  await db.deleteFrom('ink_line').where('pin_set_id', 'is', null).execute();
  await db.schema.alterTable('ink_line').dropConstraint('ink_line_pinned_unless_draft').execute();
  await db.schema.alterTable('ink_line').dropColumn('work').dropColumn('result').dropColumn('handed_in_at').execute();
  await db.schema.alterTable('ink_line').alterColumn('pin_set_id', (c) => c.setNotNull()).execute();
}
