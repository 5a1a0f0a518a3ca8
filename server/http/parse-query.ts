import { parsePageQuery, type PageQuery } from '@shared/api/paging';
import { validationFailed } from '../errors/app-error';

/** Page, size, sort and direction from a query string, or 400 validation_failed. */
export function readPageQuery<S extends string>(query: Record<string, unknown>, sortKeys: readonly S[]): PageQuery<S> {
  const parsed = parsePageQuery(query, sortKeys);
  if (!parsed.ok) throw validationFailed(parsed.details, 'The paging parameters are invalid.');
  return parsed.value;
}

const UUID_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isUuid(value: unknown): value is string {
  return typeof value === 'string' && UUID_PATTERN.test(value);
}
