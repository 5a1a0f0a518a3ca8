import type { RequestHandler } from 'express';
import { API_TOKEN_PREFIX } from '@shared/api/api-tokens';
import * as apiTokensRepository from '../api-tokens/api-tokens.repository';
import { hashApiToken } from '../api-tokens/api-tokens.service';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';

const READ_METHODS = new Set(['GET', 'HEAD']);

/** The bearer value of a request when it is an API token, else null. */
export function bearerApiToken(header: string | undefined): string | null {
  const match = header?.match(/^Bearer\s+(\S+)$/i);
  return match && match[1].startsWith(API_TOKEN_PREFIX) ? match[1] : null;
}

/**
 * For the routes API tokens open (series, coverage, stations): an API token on a read (GET) sets req.user
 * to its holder with their current roles; anything else goes to the sign-in `authenticate`. A token on a
 * write is refused, as are unknown and revoked tokens.
 */
export function createAuthenticateRead(db: Db, authenticate: RequestHandler): RequestHandler {
  return (req, res, next) => {
    const token = bearerApiToken(req.headers.authorization);
    if (token === null) return authenticate(req, res, next);
    if (!READ_METHODS.has(req.method)) {
      return next(new AppError(HTTP.forbidden, 'api_token_not_allowed', 'API tokens are read-only: sign in to change anything.'));
    }
    apiTokensRepository.useToken(db, hashApiToken(token)).then(
      (holder) => {
        if (!holder) return next(new AppError(HTTP.unauthorized, 'unauthenticated', 'This API token is unknown or has been revoked.'));
        req.user = { id: holder.personId, roles: holder.roles };
        return next();
      },
      (error: unknown) => next(error),
    );
    return undefined;
  };
}
