import type { ColumnType, Generated } from 'kysely';
import type { ScanStatus } from '@shared/api/scans';

export interface ScanTable {
  id: Generated<string>;
  sha256: string;
  /** Path of the master under STORAGE_DIR, e.g. `masters/ab/ab12….png`. */
  storage_key: string;
  media_type: string;
  /** bigint in Postgres; parsed to number by the pg type parser set in create-db.ts. */
  size_bytes: number;
  width_px: number;
  height_px: number;
  station_id: string;
  chart_form_id: string;
  period_start: Date;
  status: ScanStatus;
  original_name: string;
  uploaded_by: string;
  uploaded_at: ColumnType<Date, Date | undefined, never>;
}
