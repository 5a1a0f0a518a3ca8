import { TestBed } from '@angular/core/testing';
import type { Page, PageQuery } from '@shared/api/paging';
import { Subject, throwError, type Observable } from 'rxjs';

import { ApiError } from '../../core/http/api-error';
import { createPagedList, type PagedList } from './paged-list';

type Key = 'name' | 'code';

function build(load: (query: PageQuery<Key>) => Observable<Page<string>>): PagedList<string, Key> {
  return TestBed.runInInjectionContext(() =>
    createPagedList<string, Key>({
      initialQuery: { page: 0, pageSize: 25, sort: 'name', direction: 'asc' },
      sortKeys: ['name', 'code'],
      load,
      failureMessage: 'The list could not be loaded.',
    }),
  );
}

describe('createPagedList', () => {
  it('when the first page answers, then rows and total come from it and loading ends', () => {
    const answers = new Subject<Page<string>>();
    const list = build(() => answers);
    TestBed.tick();
    const wasLoading = list.isLoading();

    answers.next({ items: ['a', 'b'], total: 30, page: 0, pageSize: 25 });

    expect(wasLoading).toBe(true);
    expect(list.isLoading()).toBe(false);
    expect(list.rows()).toEqual(['a', 'b']);
    expect(list.total()).toBe(30);
  });

  it('when the paginator and the sort change, then the server is asked for that page and sort', () => {
    const queries: PageQuery<Key>[] = [];
    const list = build((query) => {
      queries.push(query);
      return new Subject<Page<string>>();
    });
    TestBed.tick();

    list.turnPage({ pageIndex: 2, pageSize: 50, length: 200 });
    TestBed.tick();
    list.sortBy({ active: 'code', direction: 'desc' });
    TestBed.tick();
    list.sortBy({ active: 'unknown', direction: '' });
    TestBed.tick();

    expect(queries.map((q) => [q.page, q.pageSize, q.sort, q.direction])).toEqual([
      [0, 25, 'name', 'asc'],
      [2, 50, 'name', 'asc'],
      [0, 50, 'code', 'desc'],
      [0, 50, undefined, 'asc'],
    ]);
  });

  it('when the server refuses, then its message is the failure; anything else gets the list message', () => {
    const apiFailure = build(() => throwError(() => new ApiError(403, 'forbidden', 'Only an admin may see people.')));
    const otherFailure = build(() => throwError(() => new Error('socket closed')));
    TestBed.tick();

    expect(apiFailure.failure()).toBe('Only an admin may see people.');
    expect(otherFailure.failure()).toBe('The list could not be loaded.');
    expect(otherFailure.rows()).toEqual([]);
  });

  it('when a row was added and the list reloads, then the same page is asked for again', () => {
    const queries: PageQuery<Key>[] = [];
    const list = build((query) => {
      queries.push(query);
      return new Subject<Page<string>>();
    });
    TestBed.tick();

    list.reload();
    TestBed.tick();

    expect(queries).toHaveLength(2);
    expect(queries[1]).toEqual(queries[0]);
  });
});
