import type { ColumnType, Generated } from 'kysely';
import type { ScanChangeAction } from '@shared/api/scans';

export type AuditChanges = Record<string, { before: unknown; after: unknown }>;

export interface ScanAuditTable {
  id: Generated<string>;
  scan_id: string;
  person_id: string;
  at: ColumnType<Date, Date | undefined, never>;
  action: ScanChangeAction;
  /** jsonb `{ field: { before, after } }`; written as a JSON string. */
  changes: ColumnType<AuditChanges, string, never>;
}
