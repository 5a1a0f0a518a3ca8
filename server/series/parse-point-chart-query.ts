import { parseInstantMs } from '@shared/api/parse-instant';
import { parseWith } from '@shared/api/parse-with';
import { pointChartQuerySchema } from '@shared/api/series-point-chart';
import { validationFailed } from '../errors/app-error';

/** The query of GET /api/series/point-chart, or 400 validation_failed naming stationId and/or time. */
export function parsePointChartQuery(query: Record<string, unknown>): { stationId: string; timeMs: number } {
  const parsed = parseWith(pointChartQuerySchema, query);
  const details: Record<string, string> = parsed.ok ? {} : { ...parsed.details };
  const timeMs = parseInstantMs(query['time']);
  if (timeMs === null) details['time'] = 'time must be an ISO 8601 instant with Z or an offset';
  if (!parsed.ok || timeMs === null) throw validationFailed(details, 'The point-chart query is invalid.');
  return { stationId: parsed.value.stationId, timeMs };
}
