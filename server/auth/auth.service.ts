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
  const { token, expiresAt } = issueToken(config.jwtSecret, person.id, person.roles, config.tokenTtlSeconds);
  const { passwordHash: _passwordHash, ...publicPerson } = person;
  return { token, expiresAt: expiresAt.toISOString(), person: publicPerson };
}

export async function getSignedInPerson(db: Db, personId: string): Promise<Person> {
  const person = await peopleRepository.findPersonById(db, personId);
  // The token is valid but its person is gone (removed since sign-in): treat it as signed out.
  if (!person) throw new AppError(HTTP.unauthorized, 'unauthenticated', 'Your account no longer exists.');
  return person;
}
