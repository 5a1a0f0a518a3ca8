import type { RequestHandler } from 'express';
import type { Role } from '@shared/api/roles';
import { AppError, HTTP } from '../errors/app-error';

/**
 * Lets the request through only when the signed-in person holds one of the roles.
 * Mount after `authenticate`; each route lists its roles beside its path (see the contract table).
 */
export function requireRoles(...roles: Role[]): RequestHandler {
  if (roles.length === 0) throw new Error('requireRoles needs at least one role; use authenticate alone for any signed-in person');
  return (req, _res, next) => {
    if (!req.user) throw new AppError(HTTP.unauthorized, 'unauthenticated', 'Please sign in.');
    if (!req.user.roles.some((role) => roles.includes(role))) {
      throw new AppError(HTTP.forbidden, 'forbidden', `This needs one of the roles: ${roles.join(', ')}.`);
    }
    next();
  };
}

/** The signed-in person of a request that passed `authenticate`. */
export function signedInPerson(user: Express.User | undefined): Express.User {
  if (!user) throw new AppError(HTTP.unauthorized, 'unauthenticated', 'Please sign in.');
  return user;
}
