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
    .select(['id', 'email', 'display_name', 'created_at'])
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
  const items = rows.map((row) => ({
    id: row.id,
    email: row.email,
    displayName: row.display_name,
    roles: rolesById.get(row.id) ?? [],
    createdAt: row.created_at.toISOString(),
  }));
  return { items, total };
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
