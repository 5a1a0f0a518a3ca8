import type { PageQuery } from '@shared/api/paging';
import type { PeopleChange, PeopleChangeAction } from '@shared/api/people';
import type { DbOrTrx } from '../db/database';
import type { PeopleChangeValues } from './people-change.table';

export interface NewPeopleChange {
  actorId: string | null;
  personId?: string | null;
  invitationId?: string | null;
  email: string;
  action: PeopleChangeAction;
  changes: PeopleChangeValues;
}

/** Writes a change log entry; call inside the transaction that makes the change, so both land or neither does. */
export async function insertPeopleChange(db: DbOrTrx, entry: NewPeopleChange): Promise<void> {
  await db
    .insertInto('people_change')
    .values({
      actor_id: entry.actorId,
      person_id: entry.personId ?? null,
      invitation_id: entry.invitationId ?? null,
      email: entry.email,
      action: entry.action,
      changes: JSON.stringify(entry.changes),
    })
    .execute();
}

/** The people change log, newest first. */
export async function listPeopleChanges(db: DbOrTrx, query: PageQuery): Promise<{ items: PeopleChange[]; total: number }> {
  const rows = await db
    .selectFrom('people_change')
    .leftJoin('person as actor', 'actor.id', 'people_change.actor_id')
    .select(['people_change.id', 'people_change.at', 'people_change.email', 'people_change.action', 'people_change.changes', 'actor.display_name as actor_name'])
    .orderBy('people_change.at', 'desc')
    .orderBy('people_change.id', 'desc')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await db.selectFrom('people_change').select((eb) => eb.fn.countAll<number>().as('total')).executeTakeFirstOrThrow();
  return {
    items: rows.map((row) => ({ id: row.id, at: row.at.toISOString(), actorName: row.actor_name, email: row.email, action: row.action, changes: row.changes })),
    total,
  };
}
