import type { ColumnType, Generated } from 'kysely';
import type { Role } from '@shared/api/roles';

export interface InvitationTable {
  id: Generated<string>;
  email: string;
  roles: Role[];
  token_hash: string;
  invited_by: string | null;
  created_at: ColumnType<Date, Date | undefined, never>;
  sent_at: ColumnType<Date, Date | undefined, Date>;
  expires_at: Date;
  accepted_at: Date | null;
  withdrawn_at: Date | null;
  person_id: string | null;
}

export interface PasswordResetTable {
  id: Generated<string>;
  person_id: string;
  token_hash: string;
  created_at: ColumnType<Date, Date | undefined, never>;
  expires_at: Date;
  used_at: Date | null;
}
