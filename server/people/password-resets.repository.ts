import type { DbOrTrx } from '../db/database';

export async function insertPasswordReset(db: DbOrTrx, reset: { personId: string; tokenHash: string; expiresAt: Date }): Promise<void> {
  await db.insertInto('password_reset').values({ person_id: reset.personId, token_hash: reset.tokenHash, expires_at: reset.expiresAt }).execute();
}

/** The unused, unexpired reset a link's secret opens, locked for the transaction that uses it. */
export async function findUsableReset(db: DbOrTrx, tokenHash: string): Promise<{ id: string; personId: string } | undefined> {
  const row = await db
    .selectFrom('password_reset')
    .select(['id', 'person_id'])
    .where('token_hash', '=', tokenHash)
    .where('used_at', 'is', null)
    .where('expires_at', '>', new Date())
    .forUpdate()
    .executeTakeFirst();
  return row ? { id: row.id, personId: row.person_id } : undefined;
}

/** Marks every open reset of the person used: one new password closes all the links mailed before. */
export async function useResetsOfPerson(db: DbOrTrx, personId: string): Promise<void> {
  await db.updateTable('password_reset').set({ used_at: new Date() }).where('person_id', '=', personId).where('used_at', 'is', null).execute();
}
