import { type Kysely, sql } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('chart_form')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('name', 'text', (c) => c.notNull().unique())
    .addColumn('pressure_unit', 'text', (c) => c.notNull().check(sql`pressure_unit in ('hPa', 'mbar', 'kPa', 'inHg', 'mmHg')`))
    .addColumn('pressure_min', 'double precision', (c) => c.notNull())
    .addColumn('pressure_max', 'double precision', (c) => c.notNull())
    .addColumn('drum_hours', 'double precision', (c) => c.notNull())
    .addColumn('mm_per_hour', 'double precision', (c) => c.notNull())
    .addColumn('mm_per_unit', 'double precision', (c) => c.notNull())
    .addColumn('pen_arm_radius_mm', 'double precision')
    .addColumn('pivot_pressure', 'double precision')
    .addColumn('arc_side', 'smallint', (c) => c.notNull().defaultTo(1).check(sql`arc_side in (-1, 1)`))
    .addColumn('grid_pressure_step', 'double precision', (c) => c.notNull())
    .addColumn('label_pressure_step', 'double precision', (c) => c.notNull())
    .addColumn('grid_hours_step', 'double precision', (c) => c.notNull())
    .addColumn('label_hours_step', 'double precision', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('chart_form_range_check', sql`pressure_max > pressure_min`)
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('chart_form').execute();
}
