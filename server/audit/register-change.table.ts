import type { ColumnType, Generated } from 'kysely';
import type { Register, RegisterChangeAction } from '@shared/api/register-changes';
import type { AuditChanges } from './scan-audit.table';

export interface RegisterChangeTable {
  id: Generated<string>;
  at: ColumnType<Date, Date | undefined, never>;
  person_id: string;
  register: Register;
  record_id: string;
  action: RegisterChangeAction;
  /** jsonb `{ field: { before, after } }`; written as a JSON string. */
  changes: ColumnType<AuditChanges, string, never>;
}
