import type { Page, PageQuery } from '@shared/api/paging';
import type { PeopleChange, PeopleSortKey, PersonPatch, PersonSummary } from '@shared/api/people';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import { versionConflict } from '../http/version-conflict';
import * as peopleChanges from './people-change.repository';
import * as peopleRepository from './people.repository';

export async function listPeople(db: Db, query: PageQuery<PeopleSortKey>): Promise<Page<PersonSummary>> {
  const { items, total } = await peopleRepository.listPeople(db, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

export async function listPeopleChanges(db: Db, query: PageQuery): Promise<Page<PeopleChange>> {
  const { items, total } = await peopleChanges.listPeopleChanges(db, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

function sameRoles(a: readonly string[], b: readonly string[]): boolean {
  return a.length === b.length && [...a].sort().every((role, i) => role === [...b].sort()[i]);
}

/**
 * An admin changes a person's roles or enabled state. Either change ends the person's sessions at once
 * (the session version moves on); the change log gets one entry per kind of change, in the same transaction.
 */
export async function updatePerson(db: Db, adminId: string, personId: string, patch: PersonPatch): Promise<PersonSummary> {
  return db.transaction().execute(async (trx) => {
    const before = await peopleRepository.findPersonSummary(trx, personId, { forUpdate: true });
    if (!before) throw new AppError(HTTP.notFound, 'person_not_found', 'There is no person with this id.');
    if (before.version !== patch.version) throw versionConflict('person', before.version);
    const rolesChange = patch.roles !== undefined && !sameRoles(before.roles, patch.roles);
    const disabledChange = patch.isDisabled !== undefined && patch.isDisabled !== before.isDisabled;
    if (!rolesChange && !disabledChange) return before;

    const losesAdmin = before.roles.includes('admin') && !before.isDisabled && ((rolesChange && !patch.roles!.includes('admin')) || (disabledChange && patch.isDisabled));
    if (losesAdmin && (await peopleRepository.countOtherEnabledAdmins(trx, personId)) === 0) {
      throw new AppError(HTTP.conflict, 'last_admin', 'This is the only enabled admin; make someone else admin first, or nobody could run accounts.');
    }
    if (rolesChange) {
      await peopleRepository.replaceRoles(trx, personId, patch.roles!);
      await peopleChanges.insertPeopleChange(trx, { actorId: adminId, personId, email: before.email, action: 'change_roles', changes: { roles: { before: before.roles, after: patch.roles } } });
    }
    if (disabledChange) {
      await peopleChanges.insertPeopleChange(trx, {
        actorId: adminId,
        personId,
        email: before.email,
        action: patch.isDisabled ? 'disable' : 'enable',
        changes: { isDisabled: { before: before.isDisabled, after: patch.isDisabled } },
      });
    }
    await peopleRepository.updatePerson(trx, personId, {
      ...(disabledChange ? { disabledAt: patch.isDisabled ? new Date() : null } : {}),
      endSessions: true,
      bumpVersion: true,
    });
    return (await peopleRepository.findPersonSummary(trx, personId)) as PersonSummary;
  });
}
