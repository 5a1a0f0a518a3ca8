import type { SeriesFlag } from '@shared/api/series';
import { SERIES_FLAGS } from '@shared/api/series';
import { finestStepFor, maxSeriesRangeMs, seriesQuerySchema, type SeriesAggregate, type SeriesFormat, type SeriesStep } from '@shared/api/series-query';
import { parseWith } from '@shared/api/parse-with';
import { AppError, HTTP, validationFailed } from '../errors/app-error';
import { parseInstantMs, parseUtcDateMs } from '@shared/api/parse-instant';

const MS_PER_DAY = 86_400_000;

/** A checked series query: stations, inclusive range (epoch ms), step, aggregate, flags (null: all) and format. */
export interface SeriesQuery {
  stationIds: string[];
  fromMs: number;
  toMs: number;
  step: SeriesStep;
  aggregate: SeriesAggregate;
  flags: SeriesFlag[] | null;
  format: SeriesFormat;
  withProvenance: boolean;
}

/** `from` as a UTC date or instant; `to` likewise, a date including its whole day. Null when unreadable. */
export function parseRangeEnds(fromRaw: unknown, toRaw: unknown): { fromMs: number | null; toMs: number | null } {
  const fromMs = parseUtcDateMs(fromRaw) ?? parseInstantMs(fromRaw);
  const toDateMs = parseUtcDateMs(toRaw);
  const toMs = toDateMs !== null ? toDateMs + MS_PER_DAY - 1 : parseInstantMs(toRaw);
  return { fromMs, toMs };
}

function days(ms: number): string {
  return `${Math.floor(ms / MS_PER_DAY).toLocaleString('en')} days`;
}

/**
 * The query of GET /api/series/query, or 400: validation_failed naming each bad parameter, or
 * series_range_too_large with the limit and the finest step that would answer the range.
 */
export function parseSeriesQuery(query: Record<string, unknown>): SeriesQuery {
  const parsed = parseWith(seriesQuerySchema, query);
  const details: Record<string, string> = parsed.ok ? {} : { ...parsed.details };
  const { fromMs, toMs } = parseRangeEnds(query['from'], query['to']);
  if (fromMs === null) details['from'] = 'from must be a UTC date (YYYY-MM-DD) or an ISO 8601 instant with Z or an offset';
  if (toMs === null) details['to'] = 'to must be a UTC date (YYYY-MM-DD) or an ISO 8601 instant with Z or an offset';
  if (fromMs !== null && toMs !== null && fromMs > toMs) details['to'] = 'to must not be before from';
  if (parsed.ok) {
    const value = parsed.value;
    if (value.step === 'raw' && value.aggregate !== undefined) details['aggregate'] = 'aggregate applies to steps coarser than raw';
    if (value.flags !== undefined && value.excludeFlags !== undefined) details['excludeFlags'] = 'give flags or excludeFlags, not both';
    if (value.format === 'netcdf' && value.stationId.length > 1) details['stationId'] = 'a NetCDF file holds one station; ask for JSON or CSV for several';
    if (value.provenance && value.step !== 'raw') details['provenance'] = 'provenance is given per raw point (step raw)';
  }
  if (Object.keys(details).length > 0 || !parsed.ok) throw validationFailed(details, 'The series query is invalid.');
  const value = parsed.value;
  const rangeMs = (toMs as number) - (fromMs as number);
  const limitMs = maxSeriesRangeMs(value.step, value.stationId.length);
  if (rangeMs > limitMs) {
    const suggested = finestStepFor(rangeMs, value.stationId.length);
    throw new AppError(
      HTTP.badRequest,
      'series_range_too_large',
      `At step ${value.step}, ${value.stationId.length === 1 ? 'one station' : `${value.stationId.length} stations`} may span at most ${days(limitMs)}; ` +
        (suggested ? `ask for step ${suggested} or a shorter range.` : 'ask for a shorter range.'),
      { step: value.step, maxRangeDays: Math.floor(limitMs / MS_PER_DAY), suggestedStep: suggested },
    );
  }
  let flags: SeriesFlag[] | null = null;
  if (value.flags !== undefined) flags = value.flags;
  else if (value.excludeFlags !== undefined) flags = SERIES_FLAGS.filter((flag) => !value.excludeFlags?.includes(flag));
  return {
    stationIds: [...new Set(value.stationId)],
    fromMs: fromMs as number,
    toMs: toMs as number,
    step: value.step,
    aggregate: value.aggregate ?? 'mean',
    flags,
    format: value.format,
    withProvenance: value.provenance,
  };
}
