import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('scan')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('sha256', 'text', (c) => c.notNull().unique())
    .addColumn('storage_key', 'text', (c) => c.notNull())
    .addColumn('media_type', 'text', (c) => c.notNull())
    .addColumn('size_bytes', 'bigint', (c) => c.notNull())
    .addColumn('width_px', 'integer', (c) => c.notNull())
    .addColumn('height_px', 'integer', (c) => c.notNull())
    .addColumn('station_id', 'uuid', (c) => c.notNull().references('station.id'))
    .addColumn('chart_form_id', 'uuid', (c) => c.notNull().references('chart_form.id'))
    .addColumn('period_start', 'timestamptz', (c) => c.notNull())
    .addColumn('status', 'text', (c) =>
      c.notNull().check(sql`status in ('received', 'ready_to_trace', 'traced', 'approved', 'withdrawn')`),
    )
    .addColumn('original_name', 'text', (c) => c.notNull())
    .addColumn('uploaded_by', 'uuid', (c) => c.notNull().references('person.id'))
    .addColumn('uploaded_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  // The catalogue and the Desk filter by status and station and sort by chart period.
  await db.schema.createIndex('scan_status_period_idx').on('scan').columns(['status', 'period_start']).execute();
  await db.schema.createIndex('scan_station_period_idx').on('scan').columns(['station_id', 'period_start']).execute();
  await db.schema.createIndex('scan_period_start_idx').on('scan').column('period_start').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('scan').execute();
}
