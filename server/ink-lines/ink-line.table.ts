import type { ColumnType, Generated, JSONColumnType } from 'kysely';
import type { InkLineStatus, KnotInput } from '@shared/api/ink-lines';

export interface InkLineTable {
  id: Generated<string>;
  scan_id: string;
  pin_set_id: string;
  author_id: string;
  status: InkLineStatus;
  version: Generated<number>;
  knots: JSONColumnType<KnotInput[]>;
  created_at: ColumnType<Date, Date | undefined, never>;
  updated_at: ColumnType<Date, Date | undefined, Date>;
}
