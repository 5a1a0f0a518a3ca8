import type { RequestHandler } from 'express';
import { Passport, type Strategy } from 'passport';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import { bearerApiToken } from './authenticate-read';
import { jwtStrategy, SESSION_ENDED } from './jwt-strategy';
import type { SignedInPerson } from './signed-in-person';

/** A named way of signing a request in; passport tries them in order until one accepts. */
export interface AuthStrategy {
  name: string;
  strategy: Strategy;
}

/** The strategies of the app: the bearer JWT of a sign-in. Add others (e.g. personal API tokens) here. */
export function defaultStrategies(db: Db, jwtSecret: string): AuthStrategy[] {
  return [{ name: 'jwt', strategy: jwtStrategy(db, jwtSecret) }];
}

function infoNames(info: unknown): unknown[] {
  const list = Array.isArray(info) ? info : [info];
  return list.map((item) => (item as { name?: unknown } | undefined)?.name);
}

/** Builds the middleware that signs the request in by one of the strategies and sets req.user, or answers 401. */
export function createAuthenticate(strategies: AuthStrategy[]): RequestHandler {
  // A passport instance per app, so apps built in tests do not share strategies.
  const passport = new Passport();
  for (const { name, strategy } of strategies) passport.use(name, strategy);
  const names = strategies.map((s) => s.name);
  return (req, res, next) => {
    // An API token is not a sign-in: say so instead of "Please sign in" (authenticate-read.ts takes it where it works).
    if (bearerApiToken(req.headers.authorization) !== null) {
      return next(new AppError(HTTP.forbidden, 'api_token_not_allowed', 'API tokens open only the series, coverage and station routes, to read.'));
    }
    // A custom callback so that an expired token can be told apart from a missing or forged one.
    passport.authenticate(names, { session: false }, (error: unknown, user: SignedInPerson | false, info: unknown) => {
      if (error) return next(error);
      if (!user) {
        const reasons = infoNames(info);
        if (reasons.includes('TokenExpiredError')) {
          return next(new AppError(HTTP.unauthorized, 'token_expired', 'Your session has expired. Please sign in again.'));
        }
        if (reasons.includes(SESSION_ENDED)) {
          return next(new AppError(HTTP.unauthorized, 'session_ended', 'This session has ended. Please sign in again.'));
        }
        return next(new AppError(HTTP.unauthorized, 'unauthenticated', 'Please sign in.'));
      }
      req.user = user;
      return next();
    })(req, res, next);
  };
}
