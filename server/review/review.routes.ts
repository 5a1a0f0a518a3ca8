import { Router, type RequestHandler, type Response } from 'express';
import type { Page } from '@shared/api/paging';
import { type InkLineDecisionResult, parseInkLineReturnInput, parseInkLineVersionInput, type ReviewDetail, type ReviewRow } from '@shared/api/review';
import type { RegisterChangeLogEntry } from '@shared/api/register-changes';
import type { AppDeps } from '../app-deps';
import { listRegisterChangeLog } from '../audit/register-change.service';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { AppError, HTTP } from '../errors/app-error';
import { valueOrThrow } from '../http/parse-body';
import { isUuid, readPageQuery } from '../http/parse-query';
import { REVIEW_FILTER_PARAMETERS } from './parse-review-filter';
import { parseReviewFilter } from './parse-review-filter';
import * as reviewService from './review.service';

function parseInkLineId(value: unknown): string {
  if (!isUuid(value)) throw new AppError(HTTP.notFound, 'ink_line_not_found', 'There is no ink line with this id.');
  return value;
}

/** Mounted at /api behind the JSON parser; each route authenticates itself so unknown /api paths still reach the 404. */
export function reviewRoutes({ db }: AppDeps, authenticate: RequestHandler): Router {
  const router = Router();
  const archivist = requireRoles('archivist');

  router.get('/review', authenticate, archivist, async (req, res: Response<Page<ReviewRow>>) => {
    // Oldest first, always: the queue is fair to whoever handed in first.
    res.json(await reviewService.listForReview(db, parseReviewFilter(req.query), readPageQuery(req.query, [] as const, REVIEW_FILTER_PARAMETERS)));
  });

  router.get('/ink-lines/:inkLineId/review', authenticate, archivist, async (req, res: Response<ReviewDetail>) => {
    res.json(await reviewService.getReviewDetail(db, parseInkLineId(req.params.inkLineId)));
  });

  router.get('/ink-lines/:inkLineId/change-log', authenticate, requireRoles('archivist', 'admin'), async (req, res: Response<Page<RegisterChangeLogEntry>>) => {
    res.json(await listRegisterChangeLog(db, 'ink_line', parseInkLineId(req.params.inkLineId), readPageQuery(req.query, [] as const)));
  });

  router.post('/ink-lines/:inkLineId/approve', authenticate, archivist, async (req, res: Response<InkLineDecisionResult>) => {
    const input = valueOrThrow(parseInkLineVersionInput(req.body), 'The approval is invalid.');
    res.json(await reviewService.approveInkLine(db, parseInkLineId(req.params.inkLineId), input, signedInPerson(req.user).id));
  });

  router.post('/ink-lines/:inkLineId/return', authenticate, archivist, async (req, res: Response<InkLineDecisionResult>) => {
    const input = valueOrThrow(parseInkLineReturnInput(req.body), 'The return needs a note that says what to fix.');
    res.json(await reviewService.returnInkLine(db, parseInkLineId(req.params.inkLineId), input, signedInPerson(req.user).id));
  });

  router.post('/ink-lines/:inkLineId/rework', authenticate, requireRoles('volunteer'), async (req, res: Response<InkLineDecisionResult>) => {
    const input = valueOrThrow(parseInkLineVersionInput(req.body), 'The rework is invalid.');
    res.json(await reviewService.reworkInkLine(db, parseInkLineId(req.params.inkLineId), input, signedInPerson(req.user).id));
  });

  return router;
}
