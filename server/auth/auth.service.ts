import type { Person, SignInRequest, SignInResponse } from '@shared/api/auth';
import type { Config } from '../config';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import * as peopleRepository from '../people/people.repository';
import { hashPassword, verifyPassword } from './passwords';
import { issueToken } from './tokens';

const BAD_CREDENTIALS = 'The e-mail address or password is not right.';

// Verified against when the e-mail is unknown, so an unknown address takes as long as a wrong password.
let unknownPersonHash: Promise<string> | undefined;

export async function signIn(db: Db, config: Config, request: SignInRequest): Promise<SignInResponse> {
  const person = await peopleRepository.findPersonCredentialsByEmail(db, request.email.trim());
  if (!person) {
    unknownPersonHash ??= hashPassword('no such person');
    await verifyPassword(await unknownPersonHash, request.password);
    throw new AppError(HTTP.unauthorized, 'unauthenticated', BAD_CREDENTIALS);
  }
  if (!(await verifyPassword(person.passwordHash, request.password))) {
    throw new AppError(HTTP.unauthorized, 'unauthenticated', BAD_CREDENTIALS);
  }
  // Told only to someone who knows the password: the account exists but an admin has stopped it.
  if (person.isDisabled) throw new AppError(HTTP.forbidden, 'account_disabled', 'This account is disabled. Ask an admin to enable it again.');
  return sessionFor(config, person);
}

/** A new token for a person at their current session version, with the person as the client shows them. */
export function sessionFor(config: Config, person: Person & { sessionVersion: number }): SignInResponse {
  const { token, expiresAt } = issueToken(config.jwtSecret, { personId: person.id, sessionVersion: person.sessionVersion }, config.tokenTtlSeconds);
  return { token, expiresAt: expiresAt.toISOString(), person: { id: person.id, email: person.email, displayName: person.displayName, roles: person.roles } };
}

export async function getSignedInPerson(db: Db, personId: string): Promise<Person> {
  const person = await peopleRepository.findPersonById(db, personId);
  // The token is valid but its person is gone (removed since sign-in): treat it as signed out.
  if (!person) throw new AppError(HTTP.unauthorized, 'session_ended', 'Your account no longer exists.');
  return person;
}
