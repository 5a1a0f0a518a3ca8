import type { ColumnType, Generated } from 'kysely';
import type { Role } from '@shared/api/roles';

export interface PersonTable {
  id: Generated<string>;
  email: string;
  display_name: string;
  password_hash: string;
  created_at: ColumnType<Date, Date | undefined, never>;
}

export interface PersonRoleTable {
  person_id: string;
  role: Role;
}
