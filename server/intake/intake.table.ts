import type { ColumnType, Generated } from 'kysely';
import type { ApiErrorCode } from '@shared/api/errors';
import type { IntakeOutcome } from '@shared/api/intake';
import type { InventoryRow } from './inventory-csv';

export interface IntakeBatchTable {
  id: Generated<string>;
  created_by: string;
  created_at: ColumnType<Date, Date | undefined, never>;
  label: string;
  /** jsonb: the imported inventory rows, null until one is imported. */
  inventory: ColumnType<InventoryRow[] | null, string | null | undefined, string | null>;
}

export interface IntakeFileTable {
  id: Generated<string>;
  batch_id: string;
  file_name: string;
  outcome: IntakeOutcome;
  reason: string | null;
  code: ApiErrorCode | null;
  scan_ids: ColumnType<string[], string[] | undefined, string[]>;
  at: ColumnType<Date, Date | undefined, never>;
}
