import type { ColumnType, Generated } from 'kysely';
import type { Role } from '@shared/api/roles';

export interface PersonTable {
  id: Generated<string>;
  email: string;
  display_name: string;
  password_hash: string;
  created_at: ColumnType<Date, Date | undefined, never>;
  /** Carried in each token as `sv`; a token with another value is refused. Bumped to end every session. */
  session_version: Generated<number>;
  /** Set while the account is disabled: no sign-in, no session. */
  disabled_at: Date | null;
  updated_at: Generated<Date>;
  /** Optimistic version of what an admin edits (roles, enabled state). */
  version: Generated<number>;
}

export interface PersonRoleTable {
  person_id: string;
  role: Role;
}
