import type { ColumnType } from 'kysely';

export interface DemoSeedTable {
  name: string;
  seeded_at: ColumnType<Date, Date | undefined, never>;
}
