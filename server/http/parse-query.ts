import { parsePageQuery, type PageQuery } from '@shared/api/paging';
import { validationFailed } from '../errors/app-error';

/** What every paged list takes. */
const PAGE_PARAMETERS = ['page', 'pageSize', 'sort', 'direction'] as const;

/**
 * Refuses any query parameter the route does not take, naming it and what the route takes: an unknown filter
 * (a misspelt `stationld`, or `colour`) must not be dropped silently and answer as if no filter had been asked.
 */
export function refuseUnknownQuery(query: Record<string, unknown>, taken: readonly string[]): void {
  const details: Record<string, string> = {};
  for (const key of Object.keys(query)) {
    if (!taken.includes(key)) details[key] = `${key} is not a parameter of this request; it takes ${taken.length > 0 ? taken.join(', ') : 'none'}`;
  }
  if (Object.keys(details).length > 0) throw validationFailed(details, 'The query string has parameters that are not taken.');
}

/**
 * Page, size, sort and direction from a query string, or 400 validation_failed. Any other parameter is refused
 * unless the route names it among `filters` (and reads it itself).
 */
export function readPageQuery<S extends string>(query: Record<string, unknown>, sortKeys: readonly S[], filters: readonly string[] = []): PageQuery<S> {
  refuseUnknownQuery(query, [...PAGE_PARAMETERS, ...filters]);
  const parsed = parsePageQuery(query, sortKeys);
  if (!parsed.ok) throw validationFailed(parsed.details, 'The paging parameters are invalid.');
  return parsed.value;
}

/** The shared id check under the name the routes know. */
export { isId as isUuid } from '@shared/api/parse-instant';
