import { Router, type RequestHandler, type Response } from 'express';
import { type FollowInkResult, parseFollowInkRequest } from '@shared/api/follow-ink';
import type { AppDeps } from '../app-deps';
import { requireRoles } from '../auth/require-roles';
import { validationFailed } from '../errors/app-error';
import { parseScanId } from '../scans/parse-scan-input';
import * as followInkService from './follow-ink.service';

/** POST /api/scans/:scanId/follow-ink (volunteer): the pen line found by Follow ink, as knots. Mounted at /api/scans. */
export function followInkRoutes({ db, storage }: AppDeps, authenticate: RequestHandler): Router {
  const router = Router();
  router.post('/:scanId/follow-ink', authenticate, requireRoles('volunteer'), async (req, res: Response<FollowInkResult>) => {
    const scanId = parseScanId(req.params.scanId);
    const parsed = parseFollowInkRequest(req.body);
    if (!parsed.ok) throw validationFailed(parsed.details, 'The Follow ink request has invalid fields.');
    res.json(await followInkService.followScanInk(db, storage, scanId, parsed.value));
  });
  return router;
}
