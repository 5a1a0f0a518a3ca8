import express, { Router, type RequestHandler, type Response } from 'express';
import { type DraftSaved, INK_LINE_STATUSES, type InkLineSaved, type InkLineStatus, type MyInkLine, type MyInkLineSummary, parseDraftSave, parseInkLineDraft } from '@shared/api/ink-lines';
import type { Page } from '@shared/api/paging';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { HTTP, validationFailed } from '../errors/app-error';
import { readPageQuery } from '../http/parse-query';
import { parseScanId } from '../scans/parse-scan-input';
import * as inkLinesService from './ink-lines.service';

/**
 * An ink line of 100 000 knots is about 3.5 MB of JSON, more than the app-wide 2 MB body limit, so these
 * routes parse their own body with a larger one. Mounted at /api/scans before the app-wide JSON parser.
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
  router.put(
    '/:scanId/ink-lines/draft',
    authenticate,
    requireRoles('volunteer'),
    express.json({ limit: INK_LINE_BODY_LIMIT }),
    async (req, res: Response<DraftSaved>) => {
      const scanId = parseScanId(req.params.scanId);
      const parsed = parseDraftSave(req.body);
      if (!parsed.ok) throw validationFailed(parsed.details, 'The draft has invalid fields.');
      const { isNew, saved } = await inkLinesService.saveDraft(db, scanId, parsed.value, signedInPerson(req.user).id);
      res.status(isNew ? HTTP.created : HTTP.ok).json(saved);
    },
  );
  router.get('/:scanId/ink-lines/mine', authenticate, requireRoles('volunteer'), async (req, res: Response<{ inkLine: MyInkLine | null }>) => {
    const scanId = parseScanId(req.params.scanId);
    res.json({ inkLine: await inkLinesService.findMyInkLine(db, scanId, signedInPerson(req.user).id) });
  });
  return router;
}

/** Statuses the "mine" list may be filtered by; the default is the drafts. */
function readStatuses(raw: unknown): InkLineStatus[] {
  if (raw === undefined || raw === '') return ['draft'];
  const values = typeof raw === 'string' ? raw.split(',') : [];
  const bad = values.filter((value) => !(INK_LINE_STATUSES as readonly string[]).includes(value));
  if (values.length === 0 || bad.length > 0) throw validationFailed({ status: `status must be a comma-separated list of: ${INK_LINE_STATUSES.join(', ')}` });
  return values as InkLineStatus[];
}

/** The caller's own lines across scans. Mounted at /api/ink-lines behind authenticate. */
export function myInkLinesRoutes({ db }: AppDeps): Router {
  const router = Router();
  router.get('/mine', requireRoles('volunteer'), async (req, res: Response<Page<MyInkLineSummary>>) => {
    const query = req.query as Record<string, unknown>;
    const { page, pageSize } = readPageQuery(query, [], ['status']);
    const statuses = readStatuses(query['status']);
    res.json(await inkLinesService.listMyInkLines(db, signedInPerson(req.user).id, { statuses, page, pageSize }));
  });
  return router;
}
