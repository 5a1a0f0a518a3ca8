/** A page of a server-side paged list. `page` counts from 0. */
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export type SortDirection = 'asc' | 'desc';

export const DEFAULT_PAGE_SIZE = 25;
export const MAX_PAGE_SIZE = 200;
/** Highest page number taken: far past any list Isallo holds, and low enough that the row offset stays a safe integer. */
export const MAX_PAGE = 1_000_000;

export interface PageQuery<S extends string = string> {
  page: number;
  pageSize: number;
  sort?: S;
  direction: SortDirection;
}

/**
 * Reads page, pageSize, sort and direction from a query-string record.
 * Unknown sort keys are rejected so that a typo does not silently sort by something else.
 */
export function parsePageQuery<S extends string>(
  query: Record<string, unknown>,
  sortKeys: readonly S[],
): { ok: true; value: PageQuery<S> } | { ok: false; details: Record<string, string> } {
  const details: Record<string, string> = {};
  const page = query['page'] === undefined ? 0 : Number(query['page']);
  if (!Number.isInteger(page) || page < 0 || page > MAX_PAGE) details['page'] = `page must be a whole number from 0 to ${MAX_PAGE}`;
  const pageSize = query['pageSize'] === undefined ? DEFAULT_PAGE_SIZE : Number(query['pageSize']);
  if (!Number.isInteger(pageSize) || pageSize < 1 || pageSize > MAX_PAGE_SIZE) {
    details['pageSize'] = `pageSize must be a whole number from 1 to ${MAX_PAGE_SIZE}`;
  }
  const sortRaw = query['sort'];
  let sort: S | undefined;
  if (sortRaw !== undefined && sortRaw !== '') {
    if (typeof sortRaw === 'string' && (sortKeys as readonly string[]).includes(sortRaw)) sort = sortRaw as S;
    else details['sort'] = `sort must be one of: ${sortKeys.join(', ')}`;
  }
  const directionRaw = query['direction'] ?? 'asc';
  if (directionRaw !== 'asc' && directionRaw !== 'desc') details['direction'] = 'direction must be asc or desc';
  if (Object.keys(details).length > 0) return { ok: false, details };
  return { ok: true, value: { page, pageSize, sort, direction: directionRaw as SortDirection } };
}
