import express, { Router, type RequestHandler, type Response } from 'express';
import { type InkLineSaved, parseInkLineDraft } from '@shared/api/ink-lines';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { HTTP, validationFailed } from '../errors/app-error';
import { parseScanId } from '../scans/parse-scan-input';
import * as inkLinesService from './ink-lines.service';

/**
 * An ink line of 100 000 knots is about 3.5 MB of JSON, more than the app-wide 2 MB body limit, so this
 * route parses its own body with a larger one. Mounted at /api/scans before the app-wide JSON parser.
 */
export const INK_LINE_BODY_LIMIT = '16mb';

export function inkLinesRoutes({ db }: AppDeps, authenticate: RequestHandler): Router {
  const router = Router();
  router.post(
    '/:scanId/ink-lines',
    authenticate,
    requireRoles('volunteer'),
    express.json({ limit: INK_LINE_BODY_LIMIT }),
    async (req, res: Response<InkLineSaved>) => {
      const scanId = parseScanId(req.params.scanId);
      const parsed = parseInkLineDraft(req.body);
      if (!parsed.ok) throw validationFailed(parsed.details, 'The trace has invalid fields.');
      res.status(HTTP.created).json(await inkLinesService.handInInkLine(db, scanId, parsed.value, signedInPerson(req.user).id));
    },
  );
  return router;
}
