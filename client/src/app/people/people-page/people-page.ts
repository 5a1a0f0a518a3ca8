import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatChipsModule } from '@angular/material/chips';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { DEFAULT_PAGE_SIZE } from '@shared/api/paging';
import { PEOPLE_SORT_KEYS, type PeopleSortKey, type PersonSummary } from '@shared/api/people';

import { PeopleApi } from '../people-api';
import { createPagedList } from '../../shared/paged-list/paged-list';

/** The admin's list of accounts and their roles. */
@Component({
  selector: 'isl-people-page',
  imports: [DatePipe, MatTableModule, MatSortModule, MatPaginatorModule, MatProgressBarModule, MatChipsModule],
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

  protected sortBy(sort: Sort): void {
    this.list.sortBy(sort);
  }
}
