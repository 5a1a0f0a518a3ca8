import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { DEFAULT_PAGE_SIZE } from '@shared/api/paging';
import { PEOPLE_SORT_KEYS, type PeopleSortKey, type PersonSummary } from '@shared/api/people';

import { PeopleApi } from '../people-api';
import { createPagedList } from '../../shared/paged-list/paged-list';
import { InvitationList } from '../invitation-list/invitation-list';
import { InviteForm } from '../invite-form/invite-form';
import { PersonRolesEditor } from '../person-roles-editor/person-roles-editor';

/** The admin's People area: invite, pending invitations, and the accounts with their roles and enabled state. */
@Component({
  selector: 'isl-people-page',
  imports: [DatePipe, RouterLink, MatTableModule, MatSortModule, MatPaginatorModule, MatProgressBarModule, InviteForm, InvitationList, PersonRolesEditor],
  templateUrl: './people-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeoplePage {
  private readonly peopleApi = inject(PeopleApi);

  protected readonly columns = ['displayName', 'email', 'roles', 'createdAt'];
  private readonly list = createPagedList<PersonSummary, PeopleSortKey>({
    initialQuery: { page: 0, pageSize: DEFAULT_PAGE_SIZE, sort: 'displayName', direction: 'asc' },
    sortKeys: PEOPLE_SORT_KEYS,
    load: (query) => this.peopleApi.list(query),
    failureMessage: 'People could not be loaded.',
  });
  protected readonly query = this.list.query;
  protected readonly isLoading = this.list.isLoading;
  protected readonly rows = this.list.rows;
  protected readonly total = this.list.total;
  protected readonly failure = this.list.failure;

  protected turnPage(event: PageEvent): void {
    this.list.turnPage(event);
  }

  /** Rows are rebuilt when a person changes (their version moves on), so each editor starts from the saved state. */
  protected trackPerson(_index: number, person: PersonSummary): string {
    return `${person.id}:${person.version}`;
  }

  protected reload(): void {
    this.list.reload();
  }

  protected sortBy(sort: Sort): void {
    this.list.sortBy(sort);
  }
}
