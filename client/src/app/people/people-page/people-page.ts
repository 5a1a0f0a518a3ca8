import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatChipsModule } from '@angular/material/chips';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { DEFAULT_PAGE_SIZE, type Page, type PageQuery } from '@shared/api/paging';
import { PEOPLE_SORT_KEYS, type PeopleSortKey, type PersonSummary } from '@shared/api/people';
import { catchError, map, of, switchMap } from 'rxjs';

import { ApiError } from '../../core/http/api-error';
import { PeopleApi } from '../people-api';

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
  protected readonly query = signal<PageQuery<PeopleSortKey>>({ page: 0, pageSize: DEFAULT_PAGE_SIZE, sort: 'displayName', direction: 'asc' });
  private readonly result = toSignal(
    toObservable(this.query).pipe(
      switchMap((query) =>
        this.peopleApi.list(query).pipe(
          map((page): { page: Page<PersonSummary> | null; failure: string | null } => ({ page, failure: null })),
          catchError((error: unknown) => of({ page: null, failure: error instanceof ApiError ? error.message : 'People could not be loaded.' })),
        ),
      ),
    ),
  );
  protected readonly isLoading = computed(() => this.result() === undefined);
  protected readonly rows = computed(() => this.result()?.page?.items ?? []);
  protected readonly total = computed(() => this.result()?.page?.total ?? 0);
  protected readonly failure = computed(() => this.result()?.failure ?? null);

  protected turnPage(event: PageEvent): void {
    this.query.update((query) => ({ ...query, page: event.pageIndex, pageSize: event.pageSize }));
  }

  protected sortBy(sort: Sort): void {
    const key = (PEOPLE_SORT_KEYS as readonly string[]).includes(sort.active) ? (sort.active as PeopleSortKey) : undefined;
    this.query.update((query) => ({ ...query, page: 0, sort: sort.direction === '' ? undefined : key, direction: sort.direction || 'asc' }));
  }
}
