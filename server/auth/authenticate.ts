import type { RequestHandler } from 'express';
import { Passport } from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import { isRole, type Role } from '@shared/api/roles';
import { AppError, HTTP } from '../errors/app-error';
import { bearerApiToken } from './authenticate-read';
import type { SignedInPerson } from './signed-in-person';
import { TOKEN_ALGORITHM } from './tokens';

/** Builds the middleware that verifies the bearer token and sets req.user, or answers 401. */
export function createAuthenticate(jwtSecret: string): RequestHandler {
  // A passport instance per app, so apps built in tests do not share strategies.
  const passport = new Passport();
  passport.use(
    new JwtStrategy(
      { jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(), secretOrKey: jwtSecret, algorithms: [TOKEN_ALGORITHM] },
      (payload: { sub?: unknown; roles?: unknown }, done: (error: unknown, user?: SignedInPerson | false) => void) => {
        const roles = Array.isArray(payload.roles) ? payload.roles.filter(isRole) : [];
        if (typeof payload.sub !== 'string' || payload.sub === '') return done(null, false);
        return done(null, { id: payload.sub, roles: roles as Role[] });
      },
    ),
  );
  return (req, res, next) => {
    // An API token is not a sign-in: say so instead of "Please sign in" (authenticate-read.ts takes it where it works).
    if (bearerApiToken(req.headers.authorization) !== null) {
      return next(new AppError(HTTP.forbidden, 'api_token_not_allowed', 'API tokens open only the series, coverage and station routes, to read.'));
    }
    // A custom callback so that an expired token can be told apart from a missing or forged one.
    passport.authenticate('jwt', { session: false }, (error: unknown, user: SignedInPerson | false, info: unknown) => {
      if (error) return next(error);
      if (!user) {
        if ((info as { name?: unknown } | undefined)?.name === 'TokenExpiredError') {
          return next(new AppError(HTTP.unauthorized, 'token_expired', 'Your session has expired. Please sign in again.'));
        }
        return next(new AppError(HTTP.unauthorized, 'unauthenticated', 'Please sign in.'));
      }
      req.user = user;
      return next();
    })(req, res, next);
  };
}
