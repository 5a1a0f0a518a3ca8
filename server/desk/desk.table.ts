import type { ColumnType } from 'kysely';

export interface StationTracingTable {
  station_id: string;
  /** 1, or 2 when every chart is cross-traced by a second volunteer. */
  ink_lines_required: number;
  updated_at: ColumnType<Date, Date | undefined, Date>;
}

export type TracePriorityScope = 'station' | 'box' | 'scan';

export interface TracePriorityTable {
  scope: TracePriorityScope;
  /** The station id, `collection/box`, or the scan id. */
  scope_key: string;
  priority: number;
  set_by: string | null;
  updated_at: ColumnType<Date, Date | undefined, Date>;
}

export interface ChartClaimTable {
  scan_id: string;
  person_id: string;
  claimed_at: ColumnType<Date, Date | undefined, Date>;
  expires_at: Date;
}
