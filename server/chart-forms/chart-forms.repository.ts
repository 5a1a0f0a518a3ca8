import type { ChartFormSortKey, ChartFormSummary } from '@shared/api/chart-forms';
import type { PageQuery } from '@shared/api/paging';
import type { ChartForm } from '@shared/domain/chart-form';
import type { Selectable } from 'kysely';
import type { DbOrTrx } from '../db/database';
import type { ChartFormTable } from './chart-form.table';

function toChartFormSummary(row: Selectable<ChartFormTable>): ChartFormSummary {
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
  };
}

export async function listChartForms(
  db: DbOrTrx,
  query: PageQuery<ChartFormSortKey>,
): Promise<{ items: ChartFormSummary[]; total: number }> {
  const rows = await db
    .selectFrom('chart_form')
    .selectAll()
    .orderBy('name', query.direction)
    .orderBy('id')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await db.selectFrom('chart_form').select((eb) => eb.fn.countAll<number>().as('total')).executeTakeFirstOrThrow();
  return { items: rows.map(toChartFormSummary), total };
}

export async function findChartFormById(db: DbOrTrx, chartFormId: string): Promise<ChartFormSummary | undefined> {
  const row = await db.selectFrom('chart_form').selectAll().where('id', '=', chartFormId).executeTakeFirst();
  return row ? toChartFormSummary(row) : undefined;
}

export async function findChartFormByName(db: DbOrTrx, name: string): Promise<ChartFormSummary | undefined> {
  const row = await db.selectFrom('chart_form').selectAll().where('name', '=', name).executeTakeFirst();
  return row ? toChartFormSummary(row) : undefined;
}

export async function insertChartForm(db: DbOrTrx, form: ChartForm): Promise<ChartFormSummary> {
  const row = await db
    .insertInto('chart_form')
    .values({
      name: form.name,
      pressure_unit: form.pressureUnit,
      pressure_min: form.pressureMin,
      pressure_max: form.pressureMax,
      drum_hours: form.drumHours,
      mm_per_hour: form.mmPerHour,
      mm_per_unit: form.mmPerUnit,
      pen_arm_radius_mm: form.penArmRadiusMm,
      pivot_pressure: form.pivotPressure,
      arc_side: form.arcSide,
      grid_pressure_step: form.gridPressureStep,
      label_pressure_step: form.labelPressureStep,
      grid_hours_step: form.gridHoursStep,
      label_hours_step: form.labelHoursStep,
    })
    .returningAll()
    .executeTakeFirstOrThrow();
  return toChartFormSummary(row);
}
