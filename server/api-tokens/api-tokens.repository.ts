import { sql } from 'kysely';
import type { ApiTokenSummary } from '@shared/api/api-tokens';
import type { PageQuery } from '@shared/api/paging';
import type { Role } from '@shared/api/roles';
import type { DbOrTrx } from '../db/database';

type TokenRow = { id: string; name: string; created_at: Date; last_used_at: Date | null; revoked_at: Date | null };

function toSummary(row: TokenRow): ApiTokenSummary {
  return {
    id: row.id,
    name: row.name,
    createdAt: row.created_at.toISOString(),
    lastUsedAt: row.last_used_at ? row.last_used_at.toISOString() : null,
    revokedAt: row.revoked_at ? row.revoked_at.toISOString() : null,
  };
}

const COLUMNS = ['id', 'name', 'created_at', 'last_used_at', 'revoked_at'] as const;

export async function insertToken(db: DbOrTrx, personId: string, name: string, tokenSha256: string): Promise<ApiTokenSummary> {
  const row = await db.insertInto('api_token').values({ person_id: personId, name, token_sha256: tokenSha256 }).returning(COLUMNS).executeTakeFirstOrThrow();
  return toSummary(row);
}

/** The person's tokens, newest first, one page. */
export async function listTokens(db: DbOrTrx, personId: string, query: PageQuery): Promise<{ items: ApiTokenSummary[]; total: number }> {
  const rows = await db
    .selectFrom('api_token')
    .select(COLUMNS)
    .where('person_id', '=', personId)
    .orderBy('created_at', query.direction)
    .orderBy('id')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await db.selectFrom('api_token').select((eb) => eb.fn.countAll<number>().as('total')).where('person_id', '=', personId).executeTakeFirstOrThrow();
  return { items: rows.map(toSummary), total: Number(total) };
}

/** Revokes one of the person's tokens (again is a no-op); null when the person has no such token. */
export async function revokeToken(db: DbOrTrx, personId: string, tokenId: string): Promise<ApiTokenSummary | null> {
  const row = await db
    .updateTable('api_token')
    .set({ revoked_at: sql<Date>`coalesce(revoked_at, now())` })
    .where('id', '=', tokenId)
    .where('person_id', '=', personId)
    .returning(COLUMNS)
    .executeTakeFirst();
  return row ? toSummary(row) : null;
}

/**
 * The holder of a live token and their roles now (a role taken away closes the token's routes too),
 * stamping when it was last used; null for an unknown or revoked token.
 */
export async function useToken(db: DbOrTrx, tokenSha256: string): Promise<{ personId: string; roles: Role[] } | null> {
  const row = await db
    .updateTable('api_token')
    .set({ last_used_at: sql<Date>`now()` })
    .where('token_sha256', '=', tokenSha256)
    .where('revoked_at', 'is', null)
    .returning('person_id')
    .executeTakeFirst();
  if (!row) return null;
  const roles = await db.selectFrom('person_role').select('role').where('person_id', '=', row.person_id).execute();
  return { personId: row.person_id, roles: roles.map((one) => one.role) };
}
