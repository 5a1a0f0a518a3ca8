import { Router, type RequestHandler, type Response } from 'express';
import type { Person, SignInRequest, SignInResponse } from '@shared/api/auth';
import type { AppDeps } from '../app-deps';
import { validationFailed } from '../errors/app-error';
import * as authService from './auth.service';
import { signedInPerson } from './require-roles';

function parseSignInRequest(body: unknown): SignInRequest {
  const details: Record<string, string> = {};
  const record = (typeof body === 'object' && body !== null ? body : {}) as Record<string, unknown>;
  if (typeof record['email'] !== 'string' || record['email'].trim() === '') details['email'] = 'email is required';
  if (typeof record['password'] !== 'string' || record['password'] === '') details['password'] = 'password is required';
  if (Object.keys(details).length > 0) throw validationFailed(details);
  return { email: record['email'] as string, password: record['password'] as string };
}

/** Mounted at /api/auth; sign-in is public, `me` needs a token. */
export function authRoutes({ db, config }: AppDeps, authenticate: RequestHandler): Router {
  const router = Router();
  router.post('/sign-in', async (req, res: Response<SignInResponse>) => {
    res.json(await authService.signIn(db, config, parseSignInRequest(req.body)));
  });
  router.get('/me', authenticate, async (req, res: Response<Person>) => {
    res.json(await authService.getSignedInPerson(db, signedInPerson(req.user).id));
  });
  return router;
}
