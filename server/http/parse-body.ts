import type { Parsed } from '@shared/api/field-reader';
import { AppError, HTTP, validationFailed } from '../errors/app-error';
import { isUuid } from './parse-query';

/** The value of a shared parser's result, or 400 validation_failed with its field problems. */
export function valueOrThrow<T>(parsed: Parsed<T>, message = 'The request has invalid fields.'): T {
  if (!parsed.ok) throw validationFailed(parsed.details, message);
  return parsed.value;
}

/** An id from the path, or 404 with the given code: a malformed id names nothing. */
export function parsePathId<C extends 'station_not_found' | 'chart_form_not_found' | 'instrument_not_found' | 'intake_batch_not_found' | 'scan_not_found'>(
  value: unknown,
  code: C,
  what: string,
): string {
  if (!isUuid(value)) throw new AppError(HTTP.notFound, code, `There is no ${what} with this id.`);
  return value;
}
