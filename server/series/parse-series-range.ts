import { validationFailed } from '../errors/app-error';
import { isUuid, refuseUnknownQuery } from '../http/parse-query';
import { parseUtcDateMs, readInstant } from '@shared/api/parse-instant';
import type { SeriesRange } from './series.repository';

const MS_PER_DAY = 86_400_000;

/**
 * stationId, from and to from the query. `from` and `to` are ISO 8601 UTC dates (YYYY-MM-DD) or
 * instants as readInstant takes them; a date `to` includes its whole day, so from=to=2026-03-02 is that one day.
 */
export function parseSeriesRange(query: Record<string, unknown>): SeriesRange {
  refuseUnknownQuery(query, ['stationId', 'from', 'to']);
  const details: Record<string, string> = {};
  const stationId = query['stationId'];
  if (!isUuid(stationId)) details['stationId'] = 'stationId must be a station id';

  const from = readInstant(query['from'], { allowDate: true });
  const fromMs = from.ok ? from.ms : null;
  if (!from.ok) details['from'] = `from ${from.problem}, or a UTC date (YYYY-MM-DD)`;

  const toRaw = query['to'];
  const toDateMs = parseUtcDateMs(toRaw);
  const to = readInstant(toRaw);
  const toMs = toDateMs !== null ? toDateMs + MS_PER_DAY - 1 : to.ok ? to.ms : null;
  if (toMs === null && !to.ok) details['to'] = `to ${to.problem}, or a UTC date (YYYY-MM-DD)`;

  if (fromMs !== null && toMs !== null && fromMs > toMs) details['to'] = 'to must not be before from';
  if (Object.keys(details).length > 0) throw validationFailed(details, 'The series range is invalid.');
  return { stationId: stationId as string, fromMs: fromMs as number, toMs: toMs as number };
}
