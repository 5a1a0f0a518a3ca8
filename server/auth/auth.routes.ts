import { Router, type RequestHandler, type Response } from 'express';
import {
  parseMePatch,
  parsePasswordChange,
  parsePasswordResetCompletion,
  parsePasswordResetRequest,
  type Person,
  type SignInRequest,
  type SignInResponse,
} from '@shared/api/auth';
import { parseInvitationAcceptance, type InvitationPreview } from '@shared/api/people';
import type { AppDeps } from '../app-deps';
import { HTTP, validationFailed } from '../errors/app-error';
import { valueOrThrow } from '../http/parse-body';
import { mailedLinkLimit, resetRequestLimits, signInLimits } from '../http/rate-limits';
import type { Mailer } from '../mail/mailer';
import * as invitationsService from '../people/invitations.service';
import * as accountService from './account.service';
import * as authService from './auth.service';
import { signedInPerson } from './require-roles';

const NO_CONTENT = 204;
const ACCEPTED = 202;

function parseSignInRequest(body: unknown): SignInRequest {
  const details: Record<string, string> = {};
  const record = (typeof body === 'object' && body !== null ? body : {}) as Record<string, unknown>;
  if (typeof record['email'] !== 'string' || record['email'].trim() === '') details['email'] = 'email is required';
  if (typeof record['password'] !== 'string' || record['password'] === '') details['password'] = 'password is required';
  for (const key of Object.keys(record)) if (key !== 'email' && key !== 'password') details[key] = `${key} is not a field of this request`;
  if (Object.keys(details).length > 0) throw validationFailed(details);
  return { email: record['email'] as string, password: record['password'] as string };
}

/**
 * Mounted at /api/auth. Public: sign-in, password reset by mail, the invitee's side of an invitation (all
 * rate-limited). Behind `authenticate`: the signed-in person's own account.
 */
export function authRoutes(deps: AppDeps & { mailer: Mailer }, authenticate: RequestHandler): Router {
  const { db, config, logger } = deps;
  const router = Router();
  router.post('/sign-in', ...signInLimits(), async (req, res: Response<SignInResponse>) => {
    res.json(await authService.signIn(db, config, parseSignInRequest(req.body)));
  });
  router.get('/me', authenticate, async (req, res: Response<Person>) => {
    res.json(await authService.getSignedInPerson(db, signedInPerson(req.user).id));
  });
  router.patch('/me', authenticate, async (req, res: Response<Person>) => {
    const patch = valueOrThrow(parseMePatch(req.body), 'Your name is not valid.');
    res.json(await accountService.changeName(db, signedInPerson(req.user).id, patch));
  });
  router.post('/me/password', authenticate, async (req, res: Response<SignInResponse>) => {
    const change = valueOrThrow(parsePasswordChange(req.body), 'The password change has invalid fields.');
    res.json(await accountService.changePassword(deps, signedInPerson(req.user).id, change));
  });
  router.post('/me/sign-out-everywhere', authenticate, async (req, res) => {
    await accountService.signOutEverywhere(db, signedInPerson(req.user).id);
    res.status(NO_CONTENT).end();
  });

  router.post('/password-reset-requests', ...resetRequestLimits(), (req, res) => {
    const { email } = valueOrThrow(parsePasswordResetRequest(req.body), 'The reset request has invalid fields.');
    // Answered before the work is done, and the same for every address: neither the words nor the time tell
    // whether the address has an account.
    void accountService.requestPasswordReset(deps, email, (error) => logger.error({ err: error }, 'password reset mail failed'));
    res.status(ACCEPTED).json({ message: 'If this address has an Isallo account, a mail with a link to set a new password is on its way.' });
  });
  router.post('/password-resets', mailedLinkLimit(), async (req, res: Response<SignInResponse>) => {
    const completion = valueOrThrow(parsePasswordResetCompletion(req.body), 'The new password has invalid fields.');
    res.json(await accountService.completePasswordReset(deps, completion));
  });

  router.get('/invitations/:token', mailedLinkLimit(), async (req, res: Response<InvitationPreview>) => {
    res.set('Cache-Control', 'no-store');
    res.json(await invitationsService.preview(db, req.params.token));
  });
  router.post('/invitations/:token/accept', mailedLinkLimit(), async (req, res: Response<SignInResponse>) => {
    const acceptance = valueOrThrow(parseInvitationAcceptance(req.body), 'The account has invalid fields.');
    res.status(HTTP.created).json(await invitationsService.accept(deps, req.params.token, acceptance));
  });
  return router;
}
