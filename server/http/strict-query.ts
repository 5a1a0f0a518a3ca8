import type { RequestHandler } from 'express';
import { validationFailed } from '../errors/app-error';

/** Query parameters that are lists and may be given more than once: the catalogue's `tag` everywhere, and the stations of a series query. */
const REPEATABLE = new Set(['tag']);
const SERIES_QUERY_PATH = '/series/query';
const SERIES_QUERY_REPEATABLE = new Set(['tag', 'stationId']);

const ID = '[^/]+';
/**
 * The requests that read a query string (paths under /api; /iiif takes none). Each reads and checks its own
 * parameters (readPageQuery, refuseUnknownQuery, the series parsers); every other request takes none, so any
 * parameter sent to it is refused here instead of being ignored. A new route that reads its query joins this list.
 */
const READS_QUERY = [
  '/series',
  '/series\\.csv',
  '/series/query',
  '/series/point-chart',
  '/stations',
  `/stations/${ID}/change-log`,
  `/stations/${ID}/instruments`,
  '/chart-forms',
  `/chart-forms/${ID}/change-log`,
  `/instruments/${ID}/change-log`,
  '/scans',
  '/scans/status-counts',
  `/scans/${ID}/change-log`,
  '/intake/batches',
  '/ink-lines/mine',
  `/ink-lines/${ID}/change-log`,
  '/review',
  '/desk/lines',
  '/tracing/progress',
  '/tracing/priorities',
  '/lessons',
  // DELETE takes the version read.
  `/lessons/${ID}`,
  `/lessons/${ID}/shares`,
  '/tokens',
  '/people',
  '/people/changes',
  '/invitations',
  '/dev/mails',
].map((path) => new RegExp(`^${path}/?$`));

function readsQuery(baseUrl: string, path: string): boolean {
  return baseUrl === '/api' && READS_QUERY.some((pattern) => pattern.test(path));
}

/**
 * Refuses query strings that look like an attempt to change a filter's meaning: a parameter given twice
 * (which would be read as a list) or an operator-like key such as `stationId[$ne]`. Each is a 400 naming
 * the parameter, where before the filter was silently dropped. A request that reads no query string refuses
 * any parameter at all.
 */
export const strictQuery: RequestHandler = (req, _res, next) => {
  const details: Record<string, string> = {};
  // Mounted on /api and /iiif, so the path is relative to the mount point.
  const repeatable = req.path === SERIES_QUERY_PATH ? SERIES_QUERY_REPEATABLE : REPEATABLE;
  for (const [key, value] of Object.entries(req.query)) {
    if (/[[\]$.]/.test(key)) details[key] = `${key} is not a parameter of this request (brackets, $ and dots are not taken)`;
    else if (Array.isArray(value) && !repeatable.has(key)) details[key] = `${key} is given more than once; give it once`;
  }
  if (Object.keys(details).length === 0 && !readsQuery(req.baseUrl, req.path)) {
    for (const key of Object.keys(req.query)) details[key] = `${key} is not a parameter of this request; it takes none`;
  }
  if (Object.keys(details).length > 0) throw validationFailed(details, 'The query string has parameters that are not taken.');
  next();
};
