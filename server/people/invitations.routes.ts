import { Router, type Request, type Response } from 'express';
import type { Page } from '@shared/api/paging';
import { INVITATION_SORT_KEYS, INVITATION_STATES, parseInvitationInput, type InvitationState, type InvitationSummary } from '@shared/api/people';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { AppError, HTTP, validationFailed } from '../errors/app-error';
import { valueOrThrow } from '../http/parse-body';
import { isUuid, readPageQuery } from '../http/parse-query';
import type { Mailer } from '../mail/mailer';
import * as invitationsService from './invitations.service';

const NO_CONTENT = 204;

function invitationId(req: Request): string {
  const value = req.params['invitationId'];
  if (!isUuid(value)) throw new AppError(HTTP.notFound, 'invitation_not_found', 'There is no invitation with this id.');
  return value;
}

/** `state=pending,expired` (the default: the invitations still open). */
function readStates(value: unknown): InvitationState[] {
  if (value === undefined || value === '') return ['pending', 'expired'];
  const states = typeof value === 'string' ? value.split(',') : [];
  if (states.length === 0 || !states.every((state) => (INVITATION_STATES as readonly string[]).includes(state))) {
    throw validationFailed({ state: `state must be a comma-separated list of: ${INVITATION_STATES.join(', ')}` });
  }
  return states as InvitationState[];
}

/** Mounted at /api/invitations behind authenticate; admins only. */
export function invitationsRoutes(deps: AppDeps & { mailer: Mailer }): Router {
  const router = Router();
  router.use(requireRoles('admin'));
  router.get('/', async (req, res: Response<Page<InvitationSummary>>) => {
    const { state, ...paging } = req.query;
    res.json(await invitationsService.listInvitations(deps.db, readPageQuery(paging, INVITATION_SORT_KEYS), readStates(state)));
  });
  router.post('/', async (req, res: Response<InvitationSummary>) => {
    const input = valueOrThrow(parseInvitationInput(req.body), 'The invitation has invalid fields.');
    res.status(HTTP.created).json(await invitationsService.invite(deps, signedInPerson(req.user).id, input));
  });
  router.post('/:invitationId/resend', async (req, res: Response<InvitationSummary>) => {
    res.json(await invitationsService.resend(deps, signedInPerson(req.user).id, invitationId(req)));
  });
  router.delete('/:invitationId', async (req, res) => {
    await invitationsService.withdraw(deps.db, signedInPerson(req.user).id, invitationId(req));
    res.status(NO_CONTENT).end();
  });
  return router;
}
