import { isId } from '@shared/api/field-reader';
import type { Db } from '../db/database';
import * as peopleRepository from '../people/people.repository';
import type { SignedInPerson } from './signed-in-person';

/**
 * The person a session belongs to, read from the database on every request: null when the id is not an
 * id, the person is gone or disabled, or the session version moved on (roles changed, password changed,
 * signed out everywhere). Any sign-in strategy (bearer token today) ends here.
 */
export async function loadSessionPerson(db: Db, personId: unknown, sessionVersion: unknown): Promise<SignedInPerson | null> {
  if (!isId(personId) || typeof sessionVersion !== 'number' || !Number.isInteger(sessionVersion)) return null;
  const person = await peopleRepository.findSessionPerson(db, personId);
  if (!person || person.isDisabled || person.sessionVersion !== sessionVersion) return null;
  return { id: person.id, roles: person.roles };
}
