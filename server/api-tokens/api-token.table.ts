import type { ColumnType, Generated } from 'kysely';

export interface ApiTokenTable {
  id: Generated<string>;
  person_id: string;
  name: string;
  /** Hex SHA-256 of the token: a token is 256 random bits, so a fast hash cannot be searched back. */
  token_sha256: string;
  created_at: ColumnType<Date, Date | undefined, never>;
  last_used_at: ColumnType<Date | null, Date | null | undefined, Date | null>;
  revoked_at: ColumnType<Date | null, Date | null | undefined, Date | null>;
}
