import type { ColumnType, Generated } from 'kysely';

export interface StationTable {
  id: Generated<string>;
  code: string;
  name: string;
  latitude: number | null;
  longitude: number | null;
  elevation_m: number | null;
  time_zone: string;
  created_at: ColumnType<Date, Date | undefined, never>;
}
