import type { MePatch, PasswordChangeRequest, PasswordResetCompletion, Person, SignInResponse } from '@shared/api/auth';
import { PAGES } from '@shared/api/routes';
import type { Config } from '../config';
import type { Db } from '../db/database';
import { AppError, HTTP, validationFailed } from '../errors/app-error';
import type { Mailer } from '../mail/mailer';
import { passwordResetMail } from '../mail/messages';
import * as peopleChanges from '../people/people-change.repository';
import * as passwordResets from '../people/password-resets.repository';
import * as peopleRepository from '../people/people.repository';
import { publicLink } from '../people/public-link';
import { sessionFor } from './auth.service';
import { hashLinkSecret, isLinkSecret, newLinkSecret } from './link-secret';
import { hashPassword, verifyPassword } from './passwords';
import { assertPasswordTaken } from './password-policy';

/** How long a password reset link works. */
export const PASSWORD_RESET_TTL_SECONDS = 3600;

export interface AccountDeps {
  db: Db;
  config: Config;
  mailer: Mailer;
}

async function personOrGone(db: Db, personId: string) {
  const person = await peopleRepository.findPersonById(db, personId);
  if (!person) throw new AppError(HTTP.unauthorized, 'session_ended', 'Your account no longer exists.');
  return person;
}

/** A person changes their own name; their sessions go on. */
export async function changeName(db: Db, personId: string, patch: MePatch): Promise<Person> {
  return db.transaction().execute(async (trx) => {
    const before = await peopleRepository.findPersonSummary(trx, personId, { forUpdate: true });
    if (!before) throw new AppError(HTTP.unauthorized, 'session_ended', 'Your account no longer exists.');
    if (before.displayName !== patch.displayName) {
      await peopleRepository.updatePerson(trx, personId, { displayName: patch.displayName });
      await peopleChanges.insertPeopleChange(trx, {
        actorId: personId,
        personId,
        email: before.email,
        action: 'change_name',
        changes: { displayName: { before: before.displayName, after: patch.displayName } },
      });
    }
    return { id: before.id, email: before.email, displayName: patch.displayName, roles: before.roles };
  });
}

/** A new password, given the current one: every other session ends, this one gets a fresh token. */
export async function changePassword(deps: AccountDeps, personId: string, request: PasswordChangeRequest): Promise<SignInResponse> {
  const person = await personOrGone(deps.db, personId);
  const credentials = await peopleRepository.findPersonCredentialsByEmail(deps.db, person.email);
  if (!credentials || !(await verifyPassword(credentials.passwordHash, request.currentPassword))) {
    throw validationFailed({ currentPassword: 'currentPassword is not your present password' }, 'The present password is not right.');
  }
  assertPasswordTaken('newPassword', request.newPassword, person);
  const passwordHash = await hashPassword(request.newPassword);
  return deps.db.transaction().execute(async (trx) => {
    const sessionVersion = await peopleRepository.updatePerson(trx, personId, { passwordHash, endSessions: true });
    if (sessionVersion === undefined) throw new AppError(HTTP.unauthorized, 'session_ended', 'Your account no longer exists.');
    await passwordResets.useResetsOfPerson(trx, personId);
    await peopleChanges.insertPeopleChange(trx, { actorId: personId, personId, email: person.email, action: 'change_password', changes: { password: { before: 'set', after: 'changed' } } });
    return sessionFor(deps.config, { ...person, sessionVersion });
  });
}

/** Ends every session of the person, this one included. */
export async function signOutEverywhere(db: Db, personId: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const person = await peopleRepository.findPersonSummary(trx, personId, { forUpdate: true });
    if (!person) return;
    await peopleRepository.updatePerson(trx, personId, { endSessions: true });
    await peopleChanges.insertPeopleChange(trx, { actorId: personId, personId, email: person.email, action: 'sign_out_everywhere', changes: {} });
  });
}

/**
 * Mails a reset link when the address has an enabled account, and says nothing either way, so the answer
 * cannot tell anyone whether an address has an account. Runs after the answer has gone: failures go to
 * `onFailure` (the log), never to the caller.
 */
export async function requestPasswordReset(deps: AccountDeps, email: string, onFailure: (error: unknown) => void): Promise<void> {
  try {
    const person = await peopleRepository.findPersonCredentialsByEmail(deps.db, email.trim());
    if (!person || person.isDisabled) return;
    const { token, tokenHash } = newLinkSecret();
    const expiresAt = new Date(Date.now() + PASSWORD_RESET_TTL_SECONDS * 1000);
    await deps.db.transaction().execute(async (trx) => {
      await passwordResets.insertPasswordReset(trx, { personId: person.id, tokenHash, expiresAt });
      await deps.mailer.send(passwordResetMail({ to: person.email, link: publicLink(deps.config, PAGES.passwordReset(token)), expiresAt }));
    });
  } catch (error) {
    onFailure(error);
  }
}

/** Sets the password from a reset link: the link and any other open ones stop working, every session ends, and a new one starts. */
export async function completePasswordReset(deps: AccountDeps, completion: PasswordResetCompletion): Promise<SignInResponse> {
  const notFound = () => new AppError(HTTP.notFound, 'reset_link_not_found', 'This reset link does not work: it was used or replaced, or it has expired. Ask for a new one.');
  if (!isLinkSecret(completion.token)) throw notFound();
  const tokenHash = hashLinkSecret(completion.token);
  const peek = await passwordResets.findUsableReset(deps.db, tokenHash);
  if (!peek) throw notFound();
  const person = await personOrGone(deps.db, peek.personId);
  assertPasswordTaken('newPassword', completion.newPassword, person);
  const passwordHash = await hashPassword(completion.newPassword);
  return deps.db.transaction().execute(async (trx) => {
    // Locked and checked again: two uses of one link at the same moment, only one wins.
    const reset = await passwordResets.findUsableReset(trx, tokenHash);
    if (!reset) throw notFound();
    const sessionVersion = await peopleRepository.updatePerson(trx, reset.personId, { passwordHash, endSessions: true });
    if (sessionVersion === undefined) throw notFound();
    await passwordResets.useResetsOfPerson(trx, reset.personId);
    await peopleChanges.insertPeopleChange(trx, { actorId: null, personId: reset.personId, email: person.email, action: 'reset_password', changes: { password: { before: 'set', after: 'changed' } } });
    const credentials = await peopleRepository.findPersonCredentialsByEmail(trx, person.email);
    if (!credentials || credentials.isDisabled) throw new AppError(HTTP.forbidden, 'account_disabled', 'This account is disabled. Ask an admin to enable it again.');
    return sessionFor(deps.config, { ...person, sessionVersion });
  });
}
