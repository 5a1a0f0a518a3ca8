import type { RequestHandler } from 'express';
import { validationFailed } from '../errors/app-error';

/** Query parameters that are lists and may be given more than once: the catalogue's `tag` everywhere, and the stations of a series query. */
const REPEATABLE = new Set(['tag']);
const SERIES_QUERY_PATH = '/series/query';
const SERIES_QUERY_REPEATABLE = new Set(['tag', 'stationId']);

/**
 * Refuses query strings that look like an attempt to change a filter's meaning: a parameter given twice
 * (which would be read as a list) or an operator-like key such as `stationId[$ne]`. Each is a 400 naming
 * the parameter, where before the filter was silently dropped.
 */
export const strictQuery: RequestHandler = (req, _res, next) => {
  const details: Record<string, string> = {};
  // Mounted on /api and /iiif, so the path is relative to the mount point.
  const repeatable = req.path === SERIES_QUERY_PATH ? SERIES_QUERY_REPEATABLE : REPEATABLE;
  for (const [key, value] of Object.entries(req.query)) {
    if (/[[\]$.]/.test(key)) details[key] = `${key} is not a parameter of this request (brackets, $ and dots are not taken)`;
    else if (Array.isArray(value) && !repeatable.has(key)) details[key] = `${key} is given more than once; give it once`;
  }
  if (Object.keys(details).length > 0) throw validationFailed(details, 'The query string has parameters that are not taken.');
  next();
};
