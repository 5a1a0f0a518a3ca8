import type { ColumnType, Generated } from 'kysely';
import type { DerivativeState, ScanStatus } from '@shared/api/scans';

type Defaulted<T> = ColumnType<T, T | undefined, T>;

export interface ScanTable {
  id: Generated<string>;
  /** SHA-256 of the master file; shared by every page of a multi-page master. */
  sha256: string;
  /** Path of the master under STORAGE_DIR, e.g. `masters/ab/ab12….png`. */
  storage_key: string;
  media_type: string;
  /** bigint in Postgres; parsed to number by the pg type parser set in create-db.ts. */
  size_bytes: number;
  width_px: number;
  height_px: number;
  station_id: string | null;
  chart_form_id: string | null;
  chart_start: Date | null;
  status: ScanStatus;
  original_name: string;
  uploaded_by: string;
  uploaded_at: ColumnType<Date, Date | undefined, never>;
  page_index: Defaulted<number>;
  page_count: Defaulted<number>;
  batch_id: Defaulted<string | null>;
  instrument_id: Defaulted<string | null>;
  chart_on: Defaulted<Date | null>;
  chart_off: Defaulted<Date | null>;
  observer: Defaulted<string>;
  collection: Defaulted<string>;
  box: Defaulted<string>;
  folder: Defaulted<string>;
  item: Defaulted<string>;
  condition_notes: Defaulted<string>;
  notes: Defaulted<string>;
  tags: Defaulted<string[]>;
  transcription: Defaulted<string>;
  withdrawn_reason: Defaulted<string | null>;
  dpi: Defaulted<number | null>;
  orientation: Defaulted<number | null>;
  version: Defaulted<number>;
  derivative_state: Defaulted<DerivativeState>;
  derivative_error: Defaulted<string | null>;
  derivative_attempts: Defaulted<number>;
  /** Kept by the scan_span trigger; never written by the app. */
  span_start: ColumnType<Date | null, never, never>;
  span_end: ColumnType<Date | null, never, never>;
  /** Generated tsvector; never written. */
  search: ColumnType<string, never, never>;
}
