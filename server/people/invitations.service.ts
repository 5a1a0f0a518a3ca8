import type { SignInResponse } from '@shared/api/auth';
import type { Page, PageQuery } from '@shared/api/paging';
import type { InvitationAcceptance, InvitationInput, InvitationPreview, InvitationSortKey, InvitationState, InvitationSummary } from '@shared/api/people';
import { PAGES } from '@shared/api/routes';
import { sessionFor } from '../auth/auth.service';
import { hashLinkSecret, isLinkSecret, newLinkSecret } from '../auth/link-secret';
import { hashPassword } from '../auth/passwords';
import { assertPasswordTaken } from '../auth/password-policy';
import type { Config } from '../config';
import type { Db, DbOrTrx } from '../db/database';
import { PG_UNIQUE_VIOLATION, pgErrorCode } from '../db/pg-errors';
import { AppError, HTTP } from '../errors/app-error';
import type { Mailer } from '../mail/mailer';
import { invitationMail } from '../mail/messages';
import * as invitationsRepository from './invitations.repository';
import * as peopleChanges from './people-change.repository';
import * as peopleRepository from './people.repository';
import { publicLink } from './public-link';

export interface InvitationDeps {
  db: Db;
  config: Config;
  mailer: Mailer;
}

const NOT_OPEN = 'This invitation link does not work: it was used, withdrawn or replaced by a newer one, or it has expired. Ask an admin for a new one.';

function invitationNotFound(): AppError {
  return new AppError(HTTP.notFound, 'invitation_not_found', 'There is no invitation with this id.');
}

async function sendInvitation(deps: InvitationDeps, invitation: InvitationSummary, token: string): Promise<void> {
  await deps.mailer.send(
    invitationMail({
      to: invitation.email,
      roles: invitation.roles,
      invitedByName: invitation.invitedByName,
      link: publicLink(deps.config, PAGES.invitation(token)),
      expiresAt: new Date(invitation.expiresAt),
    }),
  );
}

/** Invites an address with roles and mails the link, in one transaction: a mail that cannot go leaves no invitation. */
export async function invite(deps: InvitationDeps, adminId: string, input: InvitationInput): Promise<InvitationSummary> {
  return deps.db.transaction().execute(async (trx) => {
    if (await peopleRepository.personExistsWithEmail(trx, input.email)) {
      throw new AppError(HTTP.conflict, 'email_taken', 'Someone already has an account with this e-mail address.', { email: 'already has an account' });
    }
    const open = await invitationsRepository.findOpenInvitationByEmail(trx, input.email);
    if (open) {
      throw new AppError(HTTP.conflict, 'invitation_open', 'This address already has an open invitation; resend or withdraw it.', { invitationId: open.id });
    }
    const { token, tokenHash } = newLinkSecret();
    const expiresAt = new Date(Date.now() + deps.config.invitationTtlSeconds * 1000);
    const invitation = await invitationsRepository
      .insertInvitation(trx, { email: input.email, roles: input.roles, tokenHash, invitedBy: adminId, expiresAt })
      .catch((error: unknown) => {
        // Two admins inviting the same address at the same moment: the open-invitation index stops the second.
        if (pgErrorCode(error) === PG_UNIQUE_VIOLATION) throw new AppError(HTTP.conflict, 'invitation_open', 'This address already has an open invitation.');
        throw error;
      });
    await peopleChanges.insertPeopleChange(trx, {
      actorId: adminId,
      invitationId: invitation.id,
      email: invitation.email,
      action: 'invite',
      changes: { roles: { before: null, after: invitation.roles }, expiresAt: { before: null, after: invitation.expiresAt } },
    });
    await sendInvitation(deps, invitation, token);
    return invitation;
  });
}

async function openInvitationForAdmin(trx: DbOrTrx, invitationId: string): Promise<InvitationSummary> {
  const invitation = await invitationsRepository.findInvitation(trx, invitationId, { forUpdate: true });
  if (!invitation) throw invitationNotFound();
  if (invitation.state === 'accepted' || invitation.state === 'withdrawn') {
    throw new AppError(HTTP.conflict, 'invitation_closed', `This invitation was ${invitation.state}; it can no longer be changed.`);
  }
  return invitation;
}

/** Mails a new link with a new expiry; the earlier link stops working. An expired invitation can be resent too. */
export async function resend(deps: InvitationDeps, adminId: string, invitationId: string): Promise<InvitationSummary> {
  return deps.db.transaction().execute(async (trx) => {
    const before = await openInvitationForAdmin(trx, invitationId);
    const { token, tokenHash } = newLinkSecret();
    const expiresAt = new Date(Date.now() + deps.config.invitationTtlSeconds * 1000);
    await invitationsRepository.renewInvitation(trx, invitationId, tokenHash, expiresAt);
    const after = (await invitationsRepository.findInvitation(trx, invitationId)) as InvitationSummary;
    await peopleChanges.insertPeopleChange(trx, {
      actorId: adminId,
      invitationId,
      email: after.email,
      action: 'resend_invitation',
      changes: { expiresAt: { before: before.expiresAt, after: after.expiresAt } },
    });
    await sendInvitation(deps, after, token);
    return after;
  });
}

export async function withdraw(db: Db, adminId: string, invitationId: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const invitation = await openInvitationForAdmin(trx, invitationId);
    await invitationsRepository.markWithdrawn(trx, invitationId);
    await peopleChanges.insertPeopleChange(trx, {
      actorId: adminId,
      invitationId,
      email: invitation.email,
      action: 'withdraw_invitation',
      changes: { state: { before: invitation.state, after: 'withdrawn' } },
    });
  });
}

export async function listInvitations(db: Db, query: PageQuery<InvitationSortKey>, states: readonly InvitationState[]): Promise<Page<InvitationSummary>> {
  const { items, total } = await invitationsRepository.listInvitations(db, query, states);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

async function pendingByToken(trx: DbOrTrx, token: unknown, options: { forUpdate?: boolean } = {}): Promise<InvitationSummary> {
  const invitation = isLinkSecret(token) ? await invitationsRepository.findInvitationByTokenHash(trx, hashLinkSecret(token), options) : undefined;
  if (!invitation || invitation.state !== 'pending') throw new AppError(HTTP.notFound, 'invitation_link_not_found', NOT_OPEN);
  return invitation;
}

/** What the invitee sees before accepting. */
export async function preview(db: Db, token: unknown): Promise<InvitationPreview> {
  const invitation = await pendingByToken(db, token);
  return { email: invitation.email, roles: invitation.roles, expiresAt: invitation.expiresAt };
}

/** Makes the account with the invitation's roles and signs the new person in; the link then stops working. */
export async function accept(deps: InvitationDeps, token: unknown, acceptance: InvitationAcceptance): Promise<SignInResponse> {
  // Checked before the transaction: argon2 is slow on purpose and should not hold a row lock.
  const peek = await pendingByToken(deps.db, token);
  assertPasswordTaken('password', acceptance.password, { email: peek.email, displayName: acceptance.displayName });
  const passwordHash = await hashPassword(acceptance.password);
  return deps.db.transaction().execute(async (trx) => {
    const invitation = await pendingByToken(trx, token, { forUpdate: true });
    if (await peopleRepository.personExistsWithEmail(trx, invitation.email)) {
      throw new AppError(HTTP.conflict, 'email_taken', 'Someone already has an account with this e-mail address.');
    }
    const personId = await peopleRepository.insertPerson(trx, { email: invitation.email, displayName: acceptance.displayName, passwordHash, roles: invitation.roles });
    await invitationsRepository.markAccepted(trx, invitation.id, personId);
    await peopleChanges.insertPeopleChange(trx, {
      actorId: personId,
      personId,
      invitationId: invitation.id,
      email: invitation.email,
      action: 'accept_invitation',
      changes: { displayName: { before: null, after: acceptance.displayName }, roles: { before: null, after: invitation.roles } },
    });
    const person = (await peopleRepository.findPersonCredentialsByEmail(trx, invitation.email))!;
    return sessionFor(deps.config, person);
  });
}
