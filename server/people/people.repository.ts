import type { Person } from '@shared/api/auth';
import type { PageQuery } from '@shared/api/paging';
import type { PeopleSortKey, PersonSummary } from '@shared/api/people';
import type { Role } from '@shared/api/roles';
import { sql } from 'kysely';
import type { DbOrTrx } from '../db/database';

const SORT_COLUMNS = { email: 'person.email', displayName: 'person.display_name', createdAt: 'person.created_at' } as const;

/** Roles of each person, for a handful of ids. */
async function findRolesByPersonIds(db: DbOrTrx, personIds: string[]): Promise<Map<string, Role[]>> {
  const rolesById = new Map<string, Role[]>(personIds.map((id) => [id, []]));
  if (personIds.length === 0) return rolesById;
  const rows = await db
    .selectFrom('person_role')
    .select(['person_id', 'role'])
    .where('person_id', 'in', personIds)
    .orderBy('role')
    .execute();
  for (const row of rows) rolesById.get(row.person_id)?.push(row.role);
  return rolesById;
}

export interface PersonCredentials extends Person {
  passwordHash: string;
  sessionVersion: number;
  isDisabled: boolean;
}

/** A person with the password hash, for sign-in only; e-mail matched case-insensitively. */
export async function findPersonCredentialsByEmail(db: DbOrTrx, email: string): Promise<PersonCredentials | undefined> {
  const row = await db
    .selectFrom('person')
    .select(['id', 'email', 'display_name', 'password_hash', 'session_version', 'disabled_at'])
    .where(sql<string>`lower(email)`, '=', email.toLowerCase())
    .executeTakeFirst();
  if (!row) return undefined;
  const roles = (await findRolesByPersonIds(db, [row.id])).get(row.id) ?? [];
  return {
    id: row.id,
    email: row.email,
    displayName: row.display_name,
    roles,
    passwordHash: row.password_hash,
    sessionVersion: row.session_version,
    isDisabled: row.disabled_at !== null,
  };
}

/** What a request needs to know of its person: roles, session version and whether the account is disabled. One query. */
export async function findSessionPerson(
  db: DbOrTrx,
  personId: string,
): Promise<{ id: string; roles: Role[]; sessionVersion: number; isDisabled: boolean } | undefined> {
  const row = await db
    .selectFrom('person')
    .select((eb) => [
      'person.id',
      'person.session_version',
      'person.disabled_at',
      eb
        .fn<Role[]>('array', [eb.selectFrom('person_role').select('person_role.role').whereRef('person_role.person_id', '=', 'person.id').orderBy('person_role.role')])
        .as('roles'),
    ])
    .where('person.id', '=', personId)
    .executeTakeFirst();
  if (!row) return undefined;
  return { id: row.id, roles: row.roles, sessionVersion: row.session_version, isDisabled: row.disabled_at !== null };
}

export async function findPersonById(db: DbOrTrx, personId: string): Promise<Person | undefined> {
  const row = await db.selectFrom('person').select(['id', 'email', 'display_name']).where('id', '=', personId).executeTakeFirst();
  if (!row) return undefined;
  const roles = (await findRolesByPersonIds(db, [row.id])).get(row.id) ?? [];
  return { id: row.id, email: row.email, displayName: row.display_name, roles };
}

export async function listPeople(db: DbOrTrx, query: PageQuery<PeopleSortKey>): Promise<{ items: PersonSummary[]; total: number }> {
  const sortColumn = SORT_COLUMNS[query.sort ?? 'email'];
  const rows = await db
    .selectFrom('person')
    .select(['id', 'email', 'display_name', 'created_at', 'disabled_at', 'version'])
    .orderBy(sortColumn, query.direction)
    .orderBy('person.id')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await db
    .selectFrom('person')
    .select((eb) => eb.fn.countAll<number>().as('total'))
    .executeTakeFirstOrThrow();
  const rolesById = await findRolesByPersonIds(db, rows.map((row) => row.id));
  const items = rows.map((row) => toSummary(row, rolesById.get(row.id) ?? []));
  return { items, total };
}

function toSummary(
  row: { id: string; email: string; display_name: string; created_at: Date; disabled_at: Date | null; version: number },
  roles: Role[],
): PersonSummary {
  return {
    id: row.id,
    email: row.email,
    displayName: row.display_name,
    roles,
    createdAt: row.created_at.toISOString(),
    isDisabled: row.disabled_at !== null,
    version: row.version,
  };
}

/** A person as the admin sees them, locked for update when in a transaction that will change them. */
export async function findPersonSummary(db: DbOrTrx, personId: string, options: { forUpdate?: boolean } = {}): Promise<PersonSummary | undefined> {
  let query = db.selectFrom('person').select(['id', 'email', 'display_name', 'created_at', 'disabled_at', 'version']).where('id', '=', personId);
  if (options.forUpdate) query = query.forUpdate();
  const row = await query.executeTakeFirst();
  if (!row) return undefined;
  return toSummary(row, (await findRolesByPersonIds(db, [row.id])).get(row.id) ?? []);
}

export async function personExistsWithEmail(db: DbOrTrx, email: string): Promise<boolean> {
  const row = await db.selectFrom('person').select('id').where(sql<string>`lower(email)`, '=', email.toLowerCase()).executeTakeFirst();
  return row !== undefined;
}

/** Enabled people holding the admin role, other than the one given. */
export async function countOtherEnabledAdmins(db: DbOrTrx, personId: string): Promise<number> {
  const { total } = await db
    .selectFrom('person')
    .innerJoin('person_role', 'person_role.person_id', 'person.id')
    .select((eb) => eb.fn.countAll<number>().as('total'))
    .where('person_role.role', '=', 'admin')
    .where('person.disabled_at', 'is', null)
    .where('person.id', '<>', personId)
    .executeTakeFirstOrThrow();
  return Number(total);
}

export async function replaceRoles(db: DbOrTrx, personId: string, roles: Role[]): Promise<void> {
  await db.deleteFrom('person_role').where('person_id', '=', personId).execute();
  if (roles.length > 0) await db.insertInto('person_role').values(roles.map((role) => ({ person_id: personId, role }))).execute();
}

/**
 * Changes the person's row; `endSessions` bumps the session version, so every token issued before stops
 * at once. `version` is the optimistic version an admin read (omit for the person's own changes).
 * Returns the new session version, or undefined when the person is gone or the version moved on.
 */
export async function updatePerson(
  db: DbOrTrx,
  personId: string,
  change: { displayName?: string; passwordHash?: string; disabledAt?: Date | null; endSessions?: boolean; version?: number; bumpVersion?: boolean },
): Promise<number | undefined> {
  let query = db
    .updateTable('person')
    .set((eb) => ({
      updated_at: new Date(),
      ...(change.displayName !== undefined ? { display_name: change.displayName } : {}),
      ...(change.passwordHash !== undefined ? { password_hash: change.passwordHash } : {}),
      ...(change.disabledAt !== undefined ? { disabled_at: change.disabledAt } : {}),
      ...(change.endSessions ? { session_version: eb('session_version', '+', 1) } : {}),
      ...(change.bumpVersion ? { version: eb('version', '+', 1) } : {}),
    }))
    .where('id', '=', personId);
  if (change.version !== undefined) query = query.where('version', '=', change.version);
  const row = await query.returning('session_version').executeTakeFirst();
  return row?.session_version;
}


/** Inserts a person and their roles; returns the new id. */
export async function insertPerson(
  db: DbOrTrx,
  person: { email: string; displayName: string; passwordHash: string; roles: Role[] },
): Promise<string> {
  const { id } = await db
    .insertInto('person')
    .values({ email: person.email, display_name: person.displayName, password_hash: person.passwordHash })
    .returning('id')
    .executeTakeFirstOrThrow();
  if (person.roles.length > 0) {
    await db.insertInto('person_role').values(person.roles.map((role) => ({ person_id: id, role }))).execute();
  }
  return id;
}
