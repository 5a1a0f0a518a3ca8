import { type BenchWork, EMPTY_BENCH_WORK } from '@shared/api/bench-work';
import type { DraftSaved, DraftSaveRequest, HandInRequest, InkLineSaved, InkLineStatus, MyInkLine, MyInkLineSummary } from '@shared/api/ink-lines';
import type { Page } from '@shared/api/paging';
import { RegistrationError } from '@shared/domain/registration';
import * as auditRepository from '../audit/scan-audit.repository';
import type { Db } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import * as scansRepository from '../scans/scans.repository';
import * as seriesRepository from '../series/series.repository';
import { loadTraceableScan } from '../tracing/traceable-scan';
import { releaseClaim } from '../desk/chart-claims';
import { checkMayHandIn, compareWithOtherLines } from '../review/cross-trace';
import * as inkLinesRepository from './ink-lines.repository';
import { checkInsideImage, checkKnotTimes, checkRegistration } from './hand-in-checks';
import { computeHandIn, savedView, seriesPointsOf, storedResultOf } from './ink-line-reading';
import { diffFields, insertRegisterChange } from '../audit/register-change.repository';
import type { StoredInkLineResult } from './ink-line.table';

/** 409 draft_version_conflict: the draft changed (another tab, or a hand-in) since this page last saved it. */
function draftVersionConflict(currentVersion: number | null): AppError {
  return new AppError(
    HTTP.conflict,
    'draft_version_conflict',
    currentVersion === null
      ? 'This draft is no longer on the server (it was handed in or discarded elsewhere). Reload the Bench to see it.'
      : 'This draft was saved from another tab or window since this page last saved it. Reload the Bench to continue from the newest version.',
    { currentVersion },
  );
}

function alreadyHandedIn(): AppError {
  return new AppError(HTTP.conflict, 'already_handed_in', 'You have already handed in a line for this chart; it is waiting for review.');
}

/**
 * Autosaves the volunteer's draft on a scan. Version null creates it (the first pin); a number saves over the
 * draft if it is still at that version. Any other state answers draft_version_conflict, never a silent overwrite.
 */
export async function saveDraft(db: Db, scanId: string, request: DraftSaveRequest, authorId: string): Promise<{ isNew: boolean; saved: DraftSaved }> {
  return db.transaction().execute(async (trx) => {
    await loadTraceableScan(trx, scanId, { forUpdate: true });
    const draft = await inkLinesRepository.findOwnDraftForUpdate(trx, scanId, authorId);
    if (request.version === null) {
      if (draft) throw draftVersionConflict(draft.version);
      if (await inkLinesRepository.hasHandedIn(trx, scanId, authorId)) throw alreadyHandedIn();
      const created = await inkLinesRepository.insertDraft(trx, { scanId, authorId, work: request.work });
      if (!created) throw draftVersionConflict(null);
      return { isNew: true, saved: { inkLineId: created.id, scanId, version: created.version, updatedAt: created.updatedAt.toISOString() } };
    }
    if (!draft) {
      if (await inkLinesRepository.hasHandedIn(trx, scanId, authorId)) throw alreadyHandedIn();
      throw draftVersionConflict(null);
    }
    if (draft.version !== request.version) throw draftVersionConflict(draft.version);
    const updated = await inkLinesRepository.updateDraftWork(trx, draft.id, request.version, request.work);
    if (!updated) throw draftVersionConflict(draft.version);
    return { isNew: false, saved: { inkLineId: draft.id, scanId, version: updated.version, updatedAt: updated.updatedAt.toISOString() } };
  });
}

/**
 * Hands in a trace: checks it (pins and knots on the image, a registration within the chart form's limit, knots
 * forward in time inside the drum period, no second line by the same volunteer, no more lines than the station
 * needs), recomputes the series from the work alone through the shared pipeline (the client's numbers are never
 * used) and, in one transaction, stores the pin set, turns the caller's draft (or a new row) into a handed-in line
 * with its work and corrections, stores its points, compares it with a cross-trace, ends the author's claim and
 * marks the scan traced. A handed-in line waits for review: it reaches no station series until approved.
 */
export async function handInInkLine(db: Db, scanId: string, handIn: HandInRequest, authorId: string): Promise<InkLineSaved> {
  return db.transaction().execute(async (trx) => {
    const scan = await loadTraceableScan(trx, scanId, { needsStation: true, forUpdate: true });
    const draft = await inkLinesRepository.findOwnDraftForUpdate(trx, scanId, authorId);
    if (await inkLinesRepository.hasHandedIn(trx, scanId, authorId)) throw alreadyHandedIn();
    if (draft && draft.version !== handIn.draftVersion) throw draftVersionConflict(draft.version);
    if (!draft && handIn.draftVersion !== null) throw draftVersionConflict(null);
    // Returned lines are reworked first, and a chart takes no more lines than its station needs.
    await checkMayHandIn(trx, scan, authorId);
    checkInsideImage(handIn.work, scan);
    const form = scan.form;

    let result;
    try {
      result = computeHandIn(form, scan.chartStart.getTime(), handIn.work);
    } catch (error) {
      if (!(error instanceof RegistrationError)) throw error;
      throw new AppError(HTTP.unprocessable, 'registration_failed', `The pins do not register the chart: ${error.message}.`, {
        reason: error.code,
      });
    }
    checkRegistration(form, result.registration);
    checkKnotTimes(form, result.registration, handIn.work);
    const points = seriesPointsOf(result);
    const stored = storedResultOf(result, points);

    const pinSetId = await inkLinesRepository.insertPinSet(trx, { scanId, createdBy: authorId, pins: handIn.work.pins, fit: result.registration });
    // The knots (with their confidence and spans) go to the knots column once, not again inside the work.
    const line = { pinSetId, knots: handIn.work.knots, work: { ...handIn.work, knots: [] }, result: stored };
    const inkLine = draft
      ? await inkLinesRepository.handInDraft(trx, draft.id, line)
      : await inkLinesRepository.insertHandedInLine(trx, { ...line, scanId, authorId });
    await seriesRepository.insertSeriesPoints(trx, inkLine.id, scan.stationId, points);
    if (draft?.handed_in_at) {
      // A reworked line handed in again replaces its earlier result: the log keeps what it was (issue 13 finding 7).
      await insertRegisterChange(trx, {
        personId: authorId,
        register: 'ink_line',
        recordId: inkLine.id,
        action: 'hand_in_again',
        changes: diffFields(handInFacts(draft.pin_set_id, draft.handed_in_at, draft.knots.length, draft.result?.summary ?? null), handInFacts(pinSetId, new Date(), handIn.work.knots.length, stored.summary)),
      });
    }
    await compareWithOtherLines(trx, scanId, inkLine.id);
    await releaseClaim(trx, scanId, authorId);
    if (scan.status !== 'traced') {
      await scansRepository.updateScanStatus(trx, scanId, 'traced');
      await auditRepository.insertScanAudit(trx, { scanId, personId: authorId, action: 'status', changes: { status: { before: scan.status, after: 'traced' } } });
    }
    return savedView({ ...inkLine, scanId }, stored);
  });
}

/** What a hand-in left on its line, as the register change log records it. */
function handInFacts(pinSetId: string | null, handedInAt: Date, knotCount: number, summary: StoredInkLineResult['summary'] | null): Record<string, unknown> {
  return {
    pinSetId,
    handedInAt: handedInAt.toISOString(),
    knotCount,
    seriesPointCount: summary?.seriesPointCount ?? null,
    registrationRmsHpa: summary?.registrationRmsHpa ?? null,
    registrationRmsMinutes: summary?.registrationRmsMinutes ?? null,
    pipelineVersion: summary?.pipelineVersion ?? null,
  };
}

/** Work stored before drafts existed is `{}`: rebuilt from the pin set and the knots. */
function workOf(row: inkLinesRepository.MyInkLineRow): BenchWork {
  const work = row.work;
  // A handed-in line keeps its knots in the knots column only (work.knots is []), and a reworked line is a draft
  // again with that work: its knots come from the column until the volunteer's first save writes them.
  const draftKnots = row.status === 'draft' && Array.isArray(work.knots) ? work.knots : [];
  const knots = draftKnots.length > 0 || row.knots.length === 0 ? draftKnots : row.knots;
  if (Array.isArray(work.pins)) return { ...EMPTY_BENCH_WORK, ...work, knots };
  return { ...EMPTY_BENCH_WORK, step: 'proof', pins: row.pins ?? [], knots: row.knots };
}

/** The caller's own line on a scan (their draft first), or null when they have none. */
export async function findMyInkLine(db: Db, scanId: string, authorId: string): Promise<MyInkLine | null> {
  const row = await inkLinesRepository.findMyInkLine(db, scanId, authorId);
  if (!row) return null;
  return {
    inkLineId: row.id,
    scanId: row.scan_id,
    status: row.status,
    version: row.version,
    work: workOf(row),
    updatedAt: row.updated_at.toISOString(),
    handedInAt: row.handed_in_at ? row.handed_in_at.toISOString() : null,
    result: row.result ? savedView({ id: row.id, scanId: row.scan_id, status: row.status, version: row.version }, row.result) : null,
  };
}

/** A page of the caller's lines in the given statuses, last touched first ("My drafts" on the Desk). */
export async function listMyInkLines(
  db: Db,
  authorId: string,
  query: { statuses: readonly InkLineStatus[]; page: number; pageSize: number },
): Promise<Page<MyInkLineSummary>> {
  const { rows, total } = await inkLinesRepository.listMyInkLines(db, authorId, query);
  return {
    items: rows.map((row) => ({
      inkLineId: row.id,
      scanId: row.scan_id,
      stationName: row.station_name,
      chartStart: row.chart_start ? row.chart_start.toISOString() : null,
      status: row.status,
      version: row.version,
      pinCount: Number(row.pin_count),
      knotCount: Number(row.knot_count ?? 0),
      updatedAt: row.updated_at.toISOString(),
    })),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}
