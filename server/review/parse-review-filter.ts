import { REVIEW_STATES, type ReviewState } from '@shared/api/review';
import { validationFailed } from '../errors/app-error';
import { isUuid } from '../http/parse-query';
import { parseInstantMs, parseUtcDateMs } from '@shared/api/parse-instant';
import type { ReviewListFilter } from './review.repository';

const MS_PER_DAY = 86_400_000;

/** The review list's filters from the query: station, volunteer, period (dates or instants; a date `to` takes its whole day) and state. */
/** The review list's filter parameters, beside its paging. */
export const REVIEW_FILTER_PARAMETERS = ['state', 'stationId', 'authorId', 'from', 'to'] as const;

export function parseReviewFilter(query: Record<string, unknown>): ReviewListFilter {
  const details: Record<string, string> = {};
  const filter: ReviewListFilter = { state: 'handed_in' };
  const { stationId, authorId, from, to, state } = query;
  if (stationId !== undefined && stationId !== '') {
    if (isUuid(stationId)) filter.stationId = stationId;
    else details['stationId'] = 'stationId must be a station id';
  }
  if (authorId !== undefined && authorId !== '') {
    if (isUuid(authorId)) filter.authorId = authorId;
    else details['authorId'] = 'authorId must be a person id';
  }
  if (from !== undefined && from !== '') {
    const fromMs = parseUtcDateMs(from) ?? parseInstantMs(from);
    if (fromMs === null) details['from'] = 'from must be a UTC date (YYYY-MM-DD) or an ISO 8601 instant with Z or an offset';
    else filter.fromMs = fromMs;
  }
  if (to !== undefined && to !== '') {
    const toDateMs = parseUtcDateMs(to);
    const toMs = toDateMs !== null ? toDateMs + MS_PER_DAY - 1 : parseInstantMs(to);
    if (toMs === null) details['to'] = 'to must be a UTC date (YYYY-MM-DD) or an ISO 8601 instant with Z or an offset';
    else filter.toMs = toMs;
  }
  if (state !== undefined && state !== '') {
    if (typeof state === 'string' && (REVIEW_STATES as readonly string[]).includes(state)) filter.state = state as ReviewState;
    else details['state'] = `state must be one of: ${REVIEW_STATES.join(', ')}`;
  }
  if (filter.fromMs !== undefined && filter.toMs !== undefined && filter.fromMs > filter.toMs) details['to'] = 'to must not be before from';
  if (Object.keys(details).length > 0) throw validationFailed(details, 'The review filters are invalid.');
  return filter;
}
