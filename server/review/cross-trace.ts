import type { CrossTraceAgreementView } from '@shared/api/review';
import { compareLines } from '@shared/domain/line-agreement';
import type { DbOrTrx } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import { findInkLinesRequired, findScanInkLines } from './ink-line-state.repository';

/**
 * Who may hand in a line of this chart. The volunteer's own draft is handed in (its id is answered); a volunteer
 * who already handed in a line of the chart may not cross-trace it; a returned line is reworked, not replaced;
 * and a chart with as many other lines as its station needs takes no more.
 */
export async function checkMayHandIn(trx: DbOrTrx, scan: { id: string; stationId: string | null }, authorId: string): Promise<{ draftId: string | null }> {
  const lines = await findScanInkLines(trx, scan.id);
  const own = lines.filter((line) => line.authorId === authorId);
  // A line of the caller's own already handed in is refused before this (already_handed_in, ink-lines.service.ts).
  if (own.some((line) => line.status === 'returned')) {
    throw new AppError(HTTP.conflict, 'rework_returned_line_first', 'Your line of this chart was returned: rework it from the Desk rather than starting another.');
  }
  const others = lines.filter((line) => line.authorId !== authorId);
  const required = await findInkLinesRequired(trx, scan.stationId);
  if (others.length >= required) {
    throw new AppError(HTTP.conflict, 'chart_fully_traced', `This chart already has the ${required === 1 ? 'ink line' : `${required} independent ink lines`} its station needs.`);
  }
  return { draftId: own.find((line) => line.status === 'draft')?.id ?? null };
}

async function readPoints(db: DbOrTrx, inkLineId: string) {
  const rows = await db
    .selectFrom('series_point')
    .select(['time', 'pressure_hpa', 'uncertainty_hpa'])
    .where('ink_line_id', '=', inkLineId)
    .where('pressure_hpa', 'is not', null)
    .where('flag', '!=', 'off_scale')
    .orderBy('time')
    .execute();
  return rows.map((row) => ({ timeMs: row.time.getTime(), pressureHpa: row.pressure_hpa as number, uncertaintyHpa: row.uncertainty_hpa }));
}

/**
 * Compares a newly handed-in line with every other handed-in or approved line of its chart and stores each
 * pair's agreement (call in the hand-in's transaction, after the line's points are stored).
 */
export async function compareWithOtherLines(trx: DbOrTrx, scanId: string, inkLineId: string): Promise<void> {
  const others = (await findScanInkLines(trx, scanId)).filter(
    (line) => line.id !== inkLineId && (line.status === 'handed_in' || line.status === 'approved'),
  );
  if (others.length === 0) return;
  const mine = await readPoints(trx, inkLineId);
  for (const other of others) {
    const [a, b] = inkLineId < other.id ? [inkLineId, other.id] : [other.id, inkLineId];
    const theirs = await readPoints(trx, other.id);
    const agreement = a === inkLineId ? compareLines(mine, theirs) : compareLines(theirs, mine);
    const values = {
      common_point_count: agreement.commonPointCount,
      rms_hpa: agreement.rmsHpa,
      max_difference_hpa: agreement.maxDifferenceHpa,
      best_offset_minutes: agreement.bestOffsetMinutes,
      disagreeing_point_count: agreement.disagreeingPointCount,
      computed_at: new Date(),
    };
    await trx
      .insertInto('cross_trace_agreement')
      .values({ ink_line_a: a, ink_line_b: b, ...values })
      .onConflict((oc) => oc.columns(['ink_line_a', 'ink_line_b']).doUpdateSet(values))
      .execute();
  }
}

/** The stored agreement of a line with its cross-trace (the latest pair), or null. */
export async function findAgreements(db: DbOrTrx, inkLineIds: readonly string[]): Promise<Map<string, CrossTraceAgreementView>> {
  const found = new Map<string, CrossTraceAgreementView>();
  if (inkLineIds.length === 0) return found;
  const rows = await db
    .selectFrom('cross_trace_agreement')
    .selectAll()
    .where((eb) => eb.or([eb('ink_line_a', 'in', inkLineIds), eb('ink_line_b', 'in', inkLineIds)]))
    .orderBy('computed_at')
    .execute();
  for (const row of rows) {
    const base = {
      commonPointCount: row.common_point_count,
      rmsHpa: row.rms_hpa,
      maxDifferenceHpa: row.max_difference_hpa,
      bestOffsetMinutes: row.best_offset_minutes,
      disagreeingPointCount: row.disagreeing_point_count,
    };
    // The offset is b's shift against a; seen from b, the other line (a) is shifted the other way.
    found.set(row.ink_line_a, { otherInkLineId: row.ink_line_b, ...base });
    found.set(row.ink_line_b, { otherInkLineId: row.ink_line_a, ...base, bestOffsetMinutes: base.bestOffsetMinutes === null ? null : -base.bestOffsetMinutes });
  }
  return found;
}
