import type { InkLineStatus } from '@shared/api/ink-lines';
import type { Page, PageQuery } from '@shared/api/paging';
import type { InkLineDecisionResult, InkLineReturnInput, InkLineVersionInput, ReviewDetail, ReviewRow } from '@shared/api/review';
import * as auditRepository from '../audit/scan-audit.repository';
import type { Db, DbOrTrx } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import { versionConflict } from '../http/version-conflict';
import * as scansRepository from '../scans/scans.repository';
import { recordSeriesChanges } from '../series/series-change';
import { countsInSeries } from '../series/series-membership';
import { findInkLineScanId, insertReview, lockInkLine, moveInkLine, type InkLineForDecision } from './ink-line-state.repository';
import * as reviewRepository from './review.repository';
import type { ReviewListFilter } from './review.repository';
import { settleScanStatus } from './scan-status-from-lines';

function inkLineNotFound(): AppError {
  return new AppError(HTTP.notFound, 'ink_line_not_found', 'There is no ink line with this id.');
}

/**
 * Runs a move on one ink line in a transaction: the scan locked first (the hand-in's order), then the line,
 * its version checked (a second archivist deciding at once gets version_conflict), then `move`.
 */
async function withLockedInkLine<T>(db: Db, inkLineId: string, version: number, move: (trx: DbOrTrx, line: InkLineForDecision) => Promise<T>): Promise<T> {
  return db.transaction().execute(async (trx) => {
    const scanId = await findInkLineScanId(trx, inkLineId);
    if (!scanId) throw inkLineNotFound();
    await scansRepository.findScanForTracing(trx, scanId, { forUpdate: true });
    const line = await lockInkLine(trx, inkLineId);
    if (!line) throw inkLineNotFound();
    if (line.version !== version) throw versionConflict('ink line', line.version);
    if (line.scanStatus === 'withdrawn') throw new AppError(HTTP.conflict, 'scan_withdrawn', 'The scan of this ink line is withdrawn; restore it first.');
    return move(trx, line);
  });
}

/** The move itself, the series record when the line enters or leaves the series, and the scan's change log. */
async function decide(
  trx: DbOrTrx,
  line: InkLineForDecision,
  to: InkLineStatus,
  personId: string,
  reason: { decision: 'approved' | 'returned'; note: string } | null,
): Promise<InkLineDecisionResult> {
  const version = await moveInkLine(trx, line.id, line.version, to);
  if (version === null) throw versionConflict('ink line', line.version + 1);
  if (reason) await insertReview(trx, { inkLineId: line.id, decision: reason.decision, note: reason.note, personId });
  const wasInSeries = countsInSeries(line.status, line.scanStatus);
  const isInSeries = countsInSeries(to, line.scanStatus);
  if (line.stationId && wasInSeries !== isInSeries) {
    await recordSeriesChanges(trx, [
      {
        stationId: line.stationId,
        inkLineId: line.id,
        change: isInSeries ? 'added' : 'removed',
        personId,
        reason: reason?.decision === 'returned' ? `returned: ${reason.note}` : (reason?.decision ?? to),
      },
    ]);
  }
  await auditRepository.insertScanAudit(trx, {
    scanId: line.scanId,
    personId,
    action: 'review',
    changes: {
      inkLineId: { before: line.id, after: line.id },
      inkLineStatus: { before: line.status, after: to },
      ...(reason && reason.note !== '' ? { note: { before: null, after: reason.note } } : {}),
    },
  });
  const scanStatus = await settleScanStatus(trx, line.scanId, personId);
  return { inkLineId: line.id, scanId: line.scanId, status: to, version, scanStatus };
}

/** Approve: a handed-in line enters its station's series. */
export async function approveInkLine(db: Db, inkLineId: string, input: InkLineVersionInput, personId: string): Promise<InkLineDecisionResult> {
  return withLockedInkLine(db, inkLineId, input.version, async (trx, line) => {
    if (line.status !== 'handed_in') {
      throw new AppError(HTTP.conflict, 'ink_line_not_handed_in', `Only a handed-in ink line can be approved; this one is ${line.status.replace(/_/g, ' ')}.`);
    }
    return decide(trx, line, 'approved', personId, { decision: 'approved', note: '' });
  });
}

/** Return with a note: a handed-in (or approved) line goes back to its volunteer, and out of the series. */
export async function returnInkLine(db: Db, inkLineId: string, input: InkLineReturnInput, personId: string): Promise<InkLineDecisionResult> {
  return withLockedInkLine(db, inkLineId, input.version, async (trx, line) => {
    if (line.status !== 'handed_in' && line.status !== 'approved') {
      throw new AppError(HTTP.conflict, 'ink_line_not_handed_in', `Only a handed-in or approved ink line can be returned; this one is ${line.status.replace(/_/g, ' ')}.`);
    }
    return decide(trx, line, 'returned', personId, { decision: 'returned', note: input.note });
  });
}

/** Rework: the author takes a returned line back as a draft (same row) to fix it on the Bench and hand it in again. */
export async function reworkInkLine(db: Db, inkLineId: string, input: InkLineVersionInput, personId: string): Promise<InkLineDecisionResult> {
  return withLockedInkLine(db, inkLineId, input.version, async (trx, line) => {
    if (line.authorId !== personId) throw new AppError(HTTP.forbidden, 'not_ink_line_author', 'Only the volunteer who traced this line can rework it.');
    if (line.status !== 'returned') {
      throw new AppError(HTTP.conflict, 'ink_line_not_returned', `Only a returned ink line can be reworked; this one is ${line.status.replace(/_/g, ' ')}.`);
    }
    const version = await moveInkLine(trx, line.id, line.version, 'draft');
    if (version === null) throw versionConflict('ink line', line.version + 1);
    return { inkLineId: line.id, scanId: line.scanId, status: 'draft', version, scanStatus: line.scanStatus };
  });
}

export async function listForReview(db: Db, filter: ReviewListFilter, query: PageQuery): Promise<Page<ReviewRow>> {
  const { items, total } = await reviewRepository.listReviewRows(db, filter, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

export async function getReviewDetail(db: Db, inkLineId: string): Promise<ReviewDetail> {
  const detail = await reviewRepository.findReviewDetail(db, inkLineId);
  if (!detail) throw inkLineNotFound();
  return detail;
}
