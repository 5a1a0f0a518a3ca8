import { Router, type Response } from 'express';
import { parseApiTokenCreate, type ApiTokenCreated, type ApiTokenSummary } from '@shared/api/api-tokens';
import type { Page } from '@shared/api/paging';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { AppError, HTTP } from '../errors/app-error';
import { valueOrThrow } from '../http/parse-body';
import { isUuid, readPageQuery } from '../http/parse-query';
import * as apiTokensService from './api-tokens.service';

/** Mounted at /api/tokens behind the sign-in authenticate (an API token cannot make or list tokens). */
export function apiTokensRoutes({ db }: AppDeps): Router {
  const router = Router();
  router.use(requireRoles('climatologist'));

  router.get('/', async (req, res: Response<Page<ApiTokenSummary>>) => {
    res.json(await apiTokensService.listTokens(db, signedInPerson(req.user).id, readPageQuery(req.query, [])));
  });
  router.post('/', async (req, res: Response<ApiTokenCreated>) => {
    const input = valueOrThrow(parseApiTokenCreate(req.body), 'The API token has invalid fields.');
    res.status(HTTP.created).json(await apiTokensService.createToken(db, signedInPerson(req.user).id, input));
  });
  router.delete('/:tokenId', async (req, res: Response<ApiTokenSummary>) => {
    const tokenId = req.params.tokenId;
    if (!isUuid(tokenId)) throw new AppError(HTTP.notFound, 'api_token_not_found', 'You have no API token with this id.');
    res.json(await apiTokensService.revokeToken(db, signedInPerson(req.user).id, tokenId));
  });
  return router;
}
