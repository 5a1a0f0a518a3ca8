import type { ColumnType, Generated } from 'kysely';
import type { PressureUnit } from '@shared/domain/pressure-units';

export interface ChartFormTable {
  id: Generated<string>;
  name: string;
  pressure_unit: PressureUnit;
  pressure_min: number;
  pressure_max: number;
  drum_hours: number;
  mm_per_hour: number;
  mm_per_unit: number;
  pen_arm_radius_mm: number | null;
  pivot_pressure: number | null;
  arc_side: 1 | -1;
  grid_pressure_step: number;
  label_pressure_step: number;
  grid_hours_step: number;
  label_hours_step: number;
  version: Generated<number>;
  created_at: ColumnType<Date, Date | undefined, never>;
}
