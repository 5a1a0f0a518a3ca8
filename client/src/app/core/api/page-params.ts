import { HttpParams } from '@angular/common/http';
import type { PageQuery } from '@shared/api/paging';

/** Filters sent beside the paging fields; empty values are left out. */
export type ListFilters = Record<string, string | null | undefined>;

/** Query parameters for a paged list: page (from 0), pageSize, sort, direction, then the filters. */
export function toPageParams(query: PageQuery, filters: ListFilters = {}): HttpParams {
  let params = new HttpParams().set('page', query.page).set('pageSize', query.pageSize).set('direction', query.direction);
  if (query.sort) params = params.set('sort', query.sort);
  for (const [key, value] of Object.entries(filters)) {
    if (value !== null && value !== undefined && value !== '') params = params.set(key, value);
  }
  return params;
}
