import type { ColumnType, Generated } from 'kysely';

export interface InstrumentTable {
  id: Generated<string>;
  station_id: string;
  serial: string;
  maker: string;
  /** `date` columns come back as YYYY-MM-DD strings (type parser in create-db.ts). */
  installed_on: string | null;
  removed_on: string | null;
  notes: string;
  version: Generated<number>;
  created_at: ColumnType<Date, Date | undefined, never>;
}
