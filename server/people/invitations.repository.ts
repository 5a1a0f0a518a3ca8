import type { PageQuery } from '@shared/api/paging';
import type { InvitationSortKey, InvitationState, InvitationSummary } from '@shared/api/people';
import type { Role } from '@shared/api/roles';
import { sql } from 'kysely';
import type { DbOrTrx } from '../db/database';

const SORT_COLUMNS = { email: 'invitation.email', sentAt: 'invitation.sent_at', expiresAt: 'invitation.expires_at' } as const;

interface InvitationRow {
  id: string;
  email: string;
  roles: Role[];
  created_at: Date;
  sent_at: Date;
  expires_at: Date;
  accepted_at: Date | null;
  withdrawn_at: Date | null;
  invited_by_name: string | null;
}

export interface InvitationRecord extends InvitationSummary {
  personId: string | null;
}

function stateOf(row: InvitationRow, nowMs: number): InvitationState {
  if (row.accepted_at) return 'accepted';
  if (row.withdrawn_at) return 'withdrawn';
  return row.expires_at.getTime() <= nowMs ? 'expired' : 'pending';
}

function toSummary(row: InvitationRow, nowMs = Date.now()): InvitationSummary {
  return {
    id: row.id,
    email: row.email,
    roles: row.roles,
    state: stateOf(row, nowMs),
    invitedByName: row.invited_by_name,
    createdAt: row.created_at.toISOString(),
    sentAt: row.sent_at.toISOString(),
    expiresAt: row.expires_at.toISOString(),
  };
}

function selectInvitations(db: DbOrTrx) {
  return db
    .selectFrom('invitation')
    .leftJoin('person as inviter', 'inviter.id', 'invitation.invited_by')
    .select([
      'invitation.id',
      'invitation.email',
      'invitation.roles',
      'invitation.created_at',
      'invitation.sent_at',
      'invitation.expires_at',
      'invitation.accepted_at',
      'invitation.withdrawn_at',
      'inviter.display_name as invited_by_name',
    ]);
}

export async function insertInvitation(
  db: DbOrTrx,
  invitation: { email: string; roles: Role[]; tokenHash: string; invitedBy: string; expiresAt: Date },
): Promise<InvitationSummary> {
  const { id } = await db
    .insertInto('invitation')
    .values({ email: invitation.email, roles: invitation.roles, token_hash: invitation.tokenHash, invited_by: invitation.invitedBy, expires_at: invitation.expiresAt })
    .returning('id')
    .executeTakeFirstOrThrow();
  return (await findInvitation(db, id)) as InvitationSummary;
}

export async function findInvitation(db: DbOrTrx, invitationId: string, options: { forUpdate?: boolean } = {}): Promise<InvitationSummary | undefined> {
  let query = selectInvitations(db).where('invitation.id', '=', invitationId);
  if (options.forUpdate) query = query.forUpdate('invitation');
  const row = await query.executeTakeFirst();
  return row ? toSummary(row) : undefined;
}

/** The invitation a link's secret opens, whatever its state; locked when asked, for accepting. */
export async function findInvitationByTokenHash(db: DbOrTrx, tokenHash: string, options: { forUpdate?: boolean } = {}): Promise<InvitationSummary | undefined> {
  let query = selectInvitations(db).where('invitation.token_hash', '=', tokenHash);
  if (options.forUpdate) query = query.forUpdate('invitation');
  const row = await query.executeTakeFirst();
  return row ? toSummary(row) : undefined;
}

/** Open (not accepted, not withdrawn) invitation for an address, expired or not. */
export async function findOpenInvitationByEmail(db: DbOrTrx, email: string): Promise<InvitationSummary | undefined> {
  const row = await selectInvitations(db)
    .where(sql<string>`lower(invitation.email)`, '=', email.toLowerCase())
    .where('invitation.accepted_at', 'is', null)
    .where('invitation.withdrawn_at', 'is', null)
    .executeTakeFirst();
  return row ? toSummary(row) : undefined;
}

/** A new secret and expiry for an open invitation (the old link stops working). */
export async function renewInvitation(db: DbOrTrx, invitationId: string, tokenHash: string, expiresAt: Date): Promise<void> {
  await db.updateTable('invitation').set({ token_hash: tokenHash, expires_at: expiresAt, sent_at: new Date() }).where('id', '=', invitationId).execute();
}

export async function markWithdrawn(db: DbOrTrx, invitationId: string): Promise<void> {
  await db.updateTable('invitation').set({ withdrawn_at: new Date() }).where('id', '=', invitationId).execute();
}

export async function markAccepted(db: DbOrTrx, invitationId: string, personId: string): Promise<void> {
  await db.updateTable('invitation').set({ accepted_at: new Date(), person_id: personId }).where('id', '=', invitationId).execute();
}

/** Invitations in the given states (default: pending and expired, the ones still open), a page at a time. */
export async function listInvitations(
  db: DbOrTrx,
  query: PageQuery<InvitationSortKey>,
  states: readonly InvitationState[],
): Promise<{ items: InvitationSummary[]; total: number }> {
  const now = new Date();
  const filtered = () =>
    selectInvitations(db).where((eb) =>
      eb.or(
        states.map((state) => {
          if (state === 'accepted') return eb('invitation.accepted_at', 'is not', null);
          if (state === 'withdrawn') return eb.and([eb('invitation.accepted_at', 'is', null), eb('invitation.withdrawn_at', 'is not', null)]);
          const open = [eb('invitation.accepted_at', 'is', null), eb('invitation.withdrawn_at', 'is', null)];
          return eb.and([...open, state === 'pending' ? eb('invitation.expires_at', '>', now) : eb('invitation.expires_at', '<=', now)]);
        }),
      ),
    );
  const rows = await filtered()
    .orderBy(SORT_COLUMNS[query.sort ?? 'sentAt'], query.direction)
    .orderBy('invitation.id')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await filtered()
    .clearSelect()
    .select((eb) => eb.fn.countAll<number>().as('total'))
    .executeTakeFirstOrThrow();
  return { items: rows.map((row) => toSummary(row, now.getTime())), total: Number(total) };
}
