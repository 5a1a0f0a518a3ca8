import { type Kysely, sql } from 'kysely';

/** How well two independent ink lines of one chart agree, over their common span; one row per pair (a < b). */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('cross_trace_agreement')
    .addColumn('ink_line_a', 'uuid', (c) => c.notNull().references('ink_line.id').onDelete('cascade'))
    .addColumn('ink_line_b', 'uuid', (c) => c.notNull().references('ink_line.id').onDelete('cascade'))
    .addColumn('common_point_count', 'integer', (c) => c.notNull())
    .addColumn('rms_hpa', 'double precision')
    .addColumn('max_difference_hpa', 'double precision')
    .addColumn('best_offset_minutes', 'double precision')
    .addColumn('disagreeing_point_count', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('computed_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint('cross_trace_agreement_pk', ['ink_line_a', 'ink_line_b'])
    .addCheckConstraint('cross_trace_agreement_order', sql`ink_line_a < ink_line_b`)
    .execute();
  await db.schema.createIndex('cross_trace_agreement_b_idx').on('cross_trace_agreement').column('ink_line_b').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('cross_trace_agreement').execute();
}
