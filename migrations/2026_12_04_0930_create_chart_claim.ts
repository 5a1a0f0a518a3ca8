import { type Kysely, sql } from 'kysely';

/** A volunteer's claim on a chart from the Desk's queue; it lapses at expires_at and the chart returns to the queue. */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('chart_claim')
    .addColumn('scan_id', 'uuid', (c) => c.notNull().references('scan.id').onDelete('cascade'))
    .addColumn('person_id', 'uuid', (c) => c.notNull().references('person.id').onDelete('cascade'))
    .addColumn('claimed_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addPrimaryKeyConstraint('chart_claim_pk', ['scan_id', 'person_id'])
    .execute();
  await db.schema.createIndex('chart_claim_person_idx').on('chart_claim').columns(['person_id', 'expires_at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('chart_claim').execute();
}
