import { computed, signal, type Signal, type WritableSignal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import type { PageEvent } from '@angular/material/paginator';
import type { Sort } from '@angular/material/sort';
import type { Page, PageQuery } from '@shared/api/paging';
import { catchError, map, of, switchMap, type Observable } from 'rxjs';

import { ApiError } from '../../core/http/api-error';

/** The state of one server-paged, server-sorted table, driven by MatPaginator and MatSort. */
export interface PagedList<T, S extends string> {
  readonly query: WritableSignal<PageQuery<S>>;
  /** True until the first page has answered. */
  readonly isLoading: Signal<boolean>;
  readonly rows: Signal<T[]>;
  readonly total: Signal<number>;
  readonly failure: Signal<string | null>;
  turnPage(event: PageEvent): void;
  sortBy(sort: Sort): void;
  /** Asks for the current page again, e.g. after a row was added or edited. */
  reload(): void;
}

export interface PagedListOptions<T, S extends string> {
  initialQuery: PageQuery<S>;
  sortKeys: readonly S[];
  load: (query: PageQuery<S>) => Observable<Page<T>>;
  /** Shown when the request fails without a message from the server. */
  failureMessage: string;
}

/**
 * Builds a paged list that asks the server again whenever the page or the sort changes; a newer request
 * replaces one still running. Call it in an injection context (a field initializer), as toSignal needs one.
 */
export function createPagedList<T, S extends string>(options: PagedListOptions<T, S>): PagedList<T, S> {
  const query = signal(options.initialQuery);
  const result = toSignal(
    toObservable(query).pipe(
      switchMap((current) =>
        options.load(current).pipe(
          map((page): { page: Page<T> | null; failure: string | null } => ({ page, failure: null })),
          catchError((error: unknown) => of({ page: null, failure: error instanceof ApiError ? error.message : options.failureMessage })),
        ),
      ),
    ),
  );
  return {
    query,
    isLoading: computed(() => result() === undefined),
    rows: computed(() => result()?.page?.items ?? []),
    total: computed(() => result()?.page?.total ?? 0),
    failure: computed(() => result()?.failure ?? null),
    turnPage(event: PageEvent) {
      query.update((current) => ({ ...current, page: event.pageIndex, pageSize: event.pageSize }));
    },
    reload() {
      query.update((current) => ({ ...current }));
    },
    sortBy(sort: Sort) {
      const key = (options.sortKeys as readonly string[]).includes(sort.active) ? (sort.active as S) : undefined;
      query.update((current) => ({ ...current, page: 0, sort: sort.direction === '' ? undefined : key, direction: sort.direction || 'asc' }));
    },
  };
}
