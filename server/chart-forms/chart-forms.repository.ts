import type { ChartFormSortKey, ChartFormSummary } from '@shared/api/chart-forms';
import type { PageQuery } from '@shared/api/paging';
import type { ChartForm } from '@shared/domain/chart-form';
import type { Selectable, Updateable } from 'kysely';
import type { DbOrTrx } from '../db/database';
import type { ChartFormTable } from './chart-form.table';

type ChartFormRow = Selectable<ChartFormTable> & { scan_count: number | string | null };

function toChartFormSummary(row: ChartFormRow): ChartFormSummary {
  return {
    id: row.id,
    name: row.name,
    pressureUnit: row.pressure_unit,
    pressureMin: row.pressure_min,
    pressureMax: row.pressure_max,
    drumHours: row.drum_hours,
    mmPerHour: row.mm_per_hour,
    mmPerUnit: row.mm_per_unit,
    penArmRadiusMm: row.pen_arm_radius_mm,
    pivotPressure: row.pivot_pressure,
    // smallint comes back as a number; the check constraint keeps it to ±1.
    arcSide: row.arc_side === -1 ? -1 : 1,
    gridPressureStep: row.grid_pressure_step,
    labelPressureStep: row.label_pressure_step,
    gridHoursStep: row.grid_hours_step,
    labelHoursStep: row.label_hours_step,
    version: row.version,
    scanCount: Number(row.scan_count ?? 0),
  };
}

function toColumns(form: Partial<ChartForm>): Updateable<ChartFormTable> {
  const columns: Updateable<ChartFormTable> = {};
  if (form.name !== undefined) columns.name = form.name;
  if (form.pressureUnit !== undefined) columns.pressure_unit = form.pressureUnit;
  if (form.pressureMin !== undefined) columns.pressure_min = form.pressureMin;
  if (form.pressureMax !== undefined) columns.pressure_max = form.pressureMax;
  if (form.drumHours !== undefined) columns.drum_hours = form.drumHours;
  if (form.mmPerHour !== undefined) columns.mm_per_hour = form.mmPerHour;
  if (form.mmPerUnit !== undefined) columns.mm_per_unit = form.mmPerUnit;
  if (form.penArmRadiusMm !== undefined) columns.pen_arm_radius_mm = form.penArmRadiusMm;
  if (form.pivotPressure !== undefined) columns.pivot_pressure = form.pivotPressure;
  if (form.arcSide !== undefined) columns.arc_side = form.arcSide;
  if (form.gridPressureStep !== undefined) columns.grid_pressure_step = form.gridPressureStep;
  if (form.labelPressureStep !== undefined) columns.label_pressure_step = form.labelPressureStep;
  if (form.gridHoursStep !== undefined) columns.grid_hours_step = form.gridHoursStep;
  if (form.labelHoursStep !== undefined) columns.label_hours_step = form.labelHoursStep;
  return columns;
}

function selectChartForms(db: DbOrTrx) {
  return db
    .selectFrom('chart_form')
    .selectAll('chart_form')
    .select((eb) =>
      eb
        .selectFrom('scan')
        .select((inner) => inner.fn.countAll<number>().as('count'))
        .whereRef('scan.chart_form_id', '=', 'chart_form.id')
        .as('scan_count'),
    );
}

export async function listChartForms(
  db: DbOrTrx,
  query: PageQuery<ChartFormSortKey>,
): Promise<{ items: ChartFormSummary[]; total: number }> {
  const rows = await selectChartForms(db)
    .orderBy('chart_form.name', query.direction)
    .orderBy('chart_form.id')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await db.selectFrom('chart_form').select((eb) => eb.fn.countAll<number>().as('total')).executeTakeFirstOrThrow();
  return { items: rows.map(toChartFormSummary), total };
}

export async function findChartFormById(db: DbOrTrx, chartFormId: string): Promise<ChartFormSummary | undefined> {
  const row = await selectChartForms(db).where('chart_form.id', '=', chartFormId).executeTakeFirst();
  return row ? toChartFormSummary(row) : undefined;
}

export async function findChartFormByName(db: DbOrTrx, name: string): Promise<ChartFormSummary | undefined> {
  const row = await selectChartForms(db).where('chart_form.name', '=', name).executeTakeFirst();
  return row ? toChartFormSummary(row) : undefined;
}

export async function insertChartForm(db: DbOrTrx, form: ChartForm): Promise<ChartFormSummary> {
  const { id } = await db
    .insertInto('chart_form')
    .values(toColumns(form) as Omit<ChartFormTable, 'id' | 'created_at' | 'version'>)
    .returning('id')
    .executeTakeFirstOrThrow();
  return (await findChartFormById(db, id)) as ChartFormSummary;
}

/**
 * Applies a patch while the form is at `version` and no scan uses it (in one statement, so a scan
 * catalogued meanwhile cannot slip under an edited geometry); undefined when either fails.
 */
export async function updateUnusedChartForm(db: DbOrTrx, chartFormId: string, version: number, patch: Partial<ChartForm>): Promise<boolean> {
  const result = await db
    .updateTable('chart_form')
    .set({ ...toColumns(patch), version: (eb) => eb('version', '+', 1) })
    .where('id', '=', chartFormId)
    .where('version', '=', version)
    .where((eb) => eb.not(eb.exists(eb.selectFrom('scan').select('scan.id').whereRef('scan.chart_form_id', '=', 'chart_form.id'))))
    .executeTakeFirst();
  return Number(result.numUpdatedRows) === 1;
}
