import type { RequestHandler } from 'express';
import { validationFailed } from '../errors/app-error';

/** Dotted paths of the strings (keys or values) that hold a NUL character, at most a few. */
function nulPaths(value: unknown, path: string, found: string[]): void {
  if (found.length >= 10) return;
  if (typeof value === 'string') {
    if (value.includes('\u0000')) found.push(path || 'body');
  } else if (Array.isArray(value)) {
    value.forEach((item, index) => nulPaths(item, path ? `${path}.${index}` : String(index), found));
  } else if (typeof value === 'object' && value !== null) {
    for (const [key, item] of Object.entries(value)) {
      const itemPath = path ? `${path}.${key}` : key;
      if (key.includes('\u0000')) found.push(itemPath.replace(/\u0000/g, '\\0'));
      else nulPaths(item, itemPath, found);
    }
  }
}

/**
 * PostgreSQL text cannot hold NUL (U+0000), and no field of Isallo means one: refuse it in the query and
 * the JSON body with 400 naming the field, before any route sees it. Multipart fields are checked by the
 * error handler's backstop (the database refuses the character; that is answered 400 too).
 */
export const refuseNul: RequestHandler = (req, _res, next) => {
  const found: string[] = [];
  nulPaths(req.query, '', found);
  if (req.body !== undefined && !Buffer.isBuffer(req.body)) nulPaths(req.body, '', found);
  if (found.length > 0) {
    throw validationFailed(Object.fromEntries(found.map((path) => [path, `${path} contains a NUL character (U+0000), which no field may hold`])), 'The request holds a NUL character.');
  }
  next();
};
