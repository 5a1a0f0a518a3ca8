import type { ColumnType, Generated } from 'kysely';
import type { PeopleChangeAction } from '@shared/api/people';

export type PeopleChangeValues = Record<string, { before: unknown; after: unknown }>;

export interface PeopleChangeTable {
  id: Generated<string>;
  at: ColumnType<Date, Date | undefined, never>;
  actor_id: string | null;
  person_id: string | null;
  invitation_id: string | null;
  email: string;
  action: PeopleChangeAction;
  changes: ColumnType<PeopleChangeValues, string, never>;
}
