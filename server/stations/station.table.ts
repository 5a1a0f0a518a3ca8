import type { ColumnType, Generated } from 'kysely';
import type { TimeStandard } from '@shared/api/stations';

export interface StationTable {
  id: Generated<string>;
  code: string;
  name: string;
  latitude: number | null;
  longitude: number | null;
  elevation_m: number | null;
  time_zone: string;
  wigos_id: ColumnType<string | null, string | null | undefined>;
  barometer_height_m: ColumnType<number | null, number | null | undefined>;
  time_standard: ColumnType<TimeStandard, TimeStandard | undefined>;
  history_notes: ColumnType<string, string | undefined>;
  version: Generated<number>;
  created_at: ColumnType<Date, Date | undefined, never>;
}
