import type { ColumnType, Generated } from 'kysely';

export type SeriesChangeKind = 'added' | 'removed';

export interface SeriesChangeTable {
  id: Generated<string>;
  station_id: string;
  /** Null once the ink line itself is deleted; the record stays. */
  ink_line_id: string | null;
  change: SeriesChangeKind;
  /** Null for changes made by the system (a migration or a rebuild), not by a person. */
  person_id: string | null;
  /** Why, in words: "approved", "returned: …", "scan withdrawn: …", "scan restored". */
  reason: string;
  at: ColumnType<Date, Date | undefined, never>;
}
