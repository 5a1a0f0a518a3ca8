import type { RequestHandler } from 'express';
import { AppError, HTTP } from './app-error';

/** Mounted after every /api router: an unknown API path is a JSON 404, never the client's index.html. */
export const apiNotFound: RequestHandler = (req) => {
  throw new AppError(HTTP.notFound, 'not_found', `No API route for ${req.method} ${req.originalUrl.split('?')[0]}.`);
};
