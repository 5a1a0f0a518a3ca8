import { parsePageQuery, type PageQuery } from '@shared/api/paging';
import { validationFailed } from '../errors/app-error';

/** Page, size, sort and direction from a query string, or 400 validation_failed. */
export function readPageQuery<S extends string>(query: Record<string, unknown>, sortKeys: readonly S[]): PageQuery<S> {
  const parsed = parsePageQuery(query, sortKeys);
  if (!parsed.ok) throw validationFailed(parsed.details, 'The paging parameters are invalid.');
  return parsed.value;
}

/** The shared id check under the name the routes know. */
export { isId as isUuid } from '@shared/api/parse-instant';
