import { validationFailed } from '../errors/app-error';
import { isUuid } from '../http/parse-query';
import { parseInstantMs, parseUtcDateMs } from '../http/parse-time';
import type { SeriesRange } from './series.repository';

const MS_PER_DAY = 86_400_000;

/**
 * stationId, from and to from the query. `from` and `to` are ISO 8601 UTC dates (YYYY-MM-DD) or
 * instants with a zone; a date `to` includes its whole day, so from=to=2026-03-02 is that one day.
 */
export function parseSeriesRange(query: Record<string, unknown>): SeriesRange {
  const details: Record<string, string> = {};
  const stationId = query['stationId'];
  if (!isUuid(stationId)) details['stationId'] = 'stationId must be a station id';

  const fromRaw = query['from'];
  const fromMs = parseUtcDateMs(fromRaw) ?? parseInstantMs(fromRaw);
  if (fromMs === null) details['from'] = 'from must be a UTC date (YYYY-MM-DD) or an ISO 8601 instant with Z or an offset';

  const toRaw = query['to'];
  const toDateMs = parseUtcDateMs(toRaw);
  const toMs = toDateMs !== null ? toDateMs + MS_PER_DAY - 1 : parseInstantMs(toRaw);
  if (toMs === null) details['to'] = 'to must be a UTC date (YYYY-MM-DD) or an ISO 8601 instant with Z or an offset';

  if (fromMs !== null && toMs !== null && fromMs > toMs) details['to'] = 'to must not be before from';
  if (Object.keys(details).length > 0) throw validationFailed(details, 'The series range is invalid.');
  return { stationId: stationId as string, fromMs: fromMs as number, toMs: toMs as number };
}
