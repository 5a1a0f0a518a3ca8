import type { PageQuery } from '@shared/api/paging';
import type { ReviewDetail, ReviewedLine, ReviewHistoryEntry, ReviewRow, ReviewState, StoredPointView } from '@shared/api/review';
import type { ChartFormSummary } from '@shared/api/chart-forms';
import type { ChartForm } from '@shared/domain/chart-form';
import { pinRmsLimit } from '@shared/domain/pin-rms-limit';
import { sql } from 'kysely';
import * as chartFormsRepository from '../chart-forms/chart-forms.repository';
import type { DbOrTrx } from '../db/database';
import { findAgreements } from './cross-trace';
import { reviewCorrectionsOf } from './review-corrections';

export interface ReviewListFilter {
  stationId?: string;
  /** Charts whose chart start lies in [fromMs, toMs]. */
  fromMs?: number;
  toMs?: number;
  authorId?: string;
  state: ReviewState;
}

function selectReviewRows(db: DbOrTrx) {
  return db
    .selectFrom('ink_line')
    .innerJoin('scan', 'scan.id', 'ink_line.scan_id')
    .leftJoin('station', 'station.id', 'scan.station_id')
    .innerJoin('person', 'person.id', 'ink_line.author_id')
    .innerJoin('pin_set', 'pin_set.id', 'ink_line.pin_set_id')
    .select([
      'ink_line.id',
      'ink_line.scan_id',
      'ink_line.author_id',
      'ink_line.status',
      'ink_line.version',
      'ink_line.updated_at',
      'scan.station_id',
      'station.name as station_name',
      'scan.chart_start',
      'scan.original_name',
      'scan.box',
      'person.display_name as author_name',
      'pin_set.rms_hpa',
      'pin_set.rms_minutes',
      // The corrections the hand-in applied, as counts of the marks and readings its fits used (0 or null: none).
      sql<number | null>`(ink_line.result #>> '{summary,clock,markCount}')::int`.as('clock_mark_count'),
      sql<number | null>`(ink_line.result #>> '{summary,instrument,readingCount}')::int`.as('instrument_reading_count'),
    ]);
}

type ReviewRowRecord = Awaited<ReturnType<ReturnType<typeof selectReviewRows>['executeTakeFirstOrThrow']>>;

interface LineStats {
  first: Date | null;
  last: Date | null;
  count: number;
  suspect: number;
  gaps: number;
}

/** Span, point count, suspect points and gaps (neighbouring points more than an hour apart) of each line. */
async function findLineStats(db: DbOrTrx, inkLineIds: readonly string[]): Promise<Map<string, LineStats>> {
  const stats = new Map<string, LineStats>();
  if (inkLineIds.length === 0) return stats;
  const result = await sql<{ ink_line_id: string; first: Date; last: Date; count: string; suspect: string; gaps: string }>`
    select ink_line_id, min(time) as first, max(time) as last, count(*) as count,
           count(*) filter (where flag in ('suspect', 'off_scale')) as suspect,
           count(*) filter (where step > interval '1 hour') as gaps
    from (
      select ink_line_id, time, flag, time - lag(time) over (partition by ink_line_id order by time) as step
      from series_point where ink_line_id in (${sql.join(inkLineIds)})
    ) as points
    group by ink_line_id`.execute(db);
  for (const row of result.rows) {
    stats.set(row.ink_line_id, { first: row.first, last: row.last, count: Number(row.count), suspect: Number(row.suspect), gaps: Number(row.gaps) });
  }
  return stats;
}

async function toReviewRows(db: DbOrTrx, records: readonly ReviewRowRecord[]): Promise<ReviewRow[]> {
  const ids = records.map((record) => record.id);
  const [stats, agreements] = await Promise.all([findLineStats(db, ids), findAgreements(db, ids)]);
  return records.map((record) => {
    const lineStats = stats.get(record.id);
    return {
      inkLineId: record.id,
      scanId: record.scan_id,
      stationId: record.station_id,
      stationName: record.station_name,
      chartStart: record.chart_start?.toISOString() ?? null,
      originalName: record.original_name,
      box: record.box,
      authorId: record.author_id,
      authorName: record.author_name,
      status: record.status,
      version: record.version,
      handedInAt: record.updated_at.toISOString(),
      pinRmsHpa: record.rms_hpa,
      pinRmsMinutes: record.rms_minutes,
      spanFrom: lineStats?.first ? new Date(lineStats.first).toISOString() : null,
      spanTo: lineStats?.last ? new Date(lineStats.last).toISOString() : null,
      pointCount: lineStats?.count ?? 0,
      gapCount: lineStats?.gaps ?? 0,
      suspectShare: lineStats && lineStats.count > 0 ? lineStats.suspect / lineStats.count : 0,
      corrections: { clockMarkCount: record.clock_mark_count ?? 0, instrumentReadingCount: record.instrument_reading_count ?? 0 },
      agreement: agreements.get(record.id) ?? null,
    };
  });
}

/** A page of ink lines in one review state, oldest first (by their last change: for handed-in lines, the hand-in). */
export async function listReviewRows(db: DbOrTrx, filter: ReviewListFilter, query: PageQuery): Promise<{ items: ReviewRow[]; total: number }> {
  let base = db
    .selectFrom('ink_line')
    .innerJoin('scan', 'scan.id', 'ink_line.scan_id')
    .where('ink_line.status', '=', filter.state);
  if (filter.stationId) base = base.where('scan.station_id', '=', filter.stationId);
  if (filter.authorId) base = base.where('ink_line.author_id', '=', filter.authorId);
  if (filter.fromMs !== undefined) base = base.where('scan.chart_start', '>=', new Date(filter.fromMs));
  if (filter.toMs !== undefined) base = base.where('scan.chart_start', '<=', new Date(filter.toMs));
  const [ids, { total }] = await Promise.all([
    base
      .select('ink_line.id')
      .orderBy('ink_line.updated_at', 'asc')
      .orderBy('ink_line.id')
      .limit(query.pageSize)
      .offset(query.page * query.pageSize)
      .execute(),
    base.select((eb) => eb.fn.countAll<number>().as('total')).executeTakeFirstOrThrow(),
  ]);
  if (ids.length === 0) return { items: [], total: Number(total) };
  const records = await selectReviewRows(db).where('ink_line.id', 'in', ids.map((row) => row.id)).execute();
  const byId = new Map(records.map((record) => [record.id, record]));
  return { items: await toReviewRows(db, ids.map((row) => byId.get(row.id)!)), total: Number(total) };
}

async function readLine(db: DbOrTrx, inkLineId: string): Promise<ReviewedLine | undefined> {
  const row = await db
    .selectFrom('ink_line')
    .innerJoin('pin_set', 'pin_set.id', 'ink_line.pin_set_id')
    .innerJoin('person', 'person.id', 'ink_line.author_id')
    .select(['ink_line.id', 'ink_line.status', 'ink_line.knots', 'pin_set.pins', 'pin_set.fit', 'person.display_name'])
    .where('ink_line.id', '=', inkLineId)
    .executeTakeFirst();
  if (!row) return undefined;
  const points = await db
    .selectFrom('series_point')
    .select(['time', 'pressure_hpa', 'uncertainty_hpa', 'flag'])
    .where('ink_line_id', '=', inkLineId)
    .where('pressure_hpa', 'is not', null)
    .orderBy('time')
    .execute();
  return {
    inkLineId: row.id,
    authorName: row.display_name,
    status: row.status,
    pins: row.pins,
    residuals: (row.fit.residuals ?? []).map((residual) => ({ index: residual.index, pressureHpa: residual.pressureHpa, minutes: residual.minutes })),
    knots: row.knots,
    points: points.map(
      (point): StoredPointView => ({ time: point.time.toISOString(), pressureHpa: point.pressure_hpa as number, uncertaintyHpa: point.uncertainty_hpa, flag: point.flag }),
    ),
  };
}

async function readHistory(db: DbOrTrx, inkLineId: string): Promise<ReviewHistoryEntry[]> {
  const rows = await db
    .selectFrom('ink_line_review')
    .innerJoin('person', 'person.id', 'ink_line_review.person_id')
    .select(['ink_line_review.decision', 'ink_line_review.note', 'ink_line_review.at', 'person.display_name'])
    .where('ink_line_review.ink_line_id', '=', inkLineId)
    .orderBy('ink_line_review.id', 'desc')
    // A line goes round at most a few times; the page shows the latest decisions.
    .limit(50)
    .execute();
  return rows.map((row) => ({ decision: row.decision, note: row.note, personName: row.display_name, at: row.at.toISOString() }));
}

/** The form's geometry alone, without the catalogue's counters. */
function chartFormOf({ id: _id, version: _version, scanCount: _scanCount, ...form }: ChartFormSummary): ChartForm {
  return form;
}

/** Everything the review page shows of one ink line, or undefined when there is no such line. */
export async function findReviewDetail(db: DbOrTrx, inkLineId: string): Promise<ReviewDetail | undefined> {
  const record = await selectReviewRows(db).where('ink_line.id', '=', inkLineId).executeTakeFirst();
  if (!record) return undefined;
  const [row] = await toReviewRows(db, [record]);
  const scan = await db
    .selectFrom('scan')
    .leftJoin('chart_form', 'chart_form.id', 'scan.chart_form_id')
    .select(['scan.id', 'scan.width_px', 'scan.height_px', 'scan.status', 'scan.chart_form_id', 'chart_form.name as chart_form_name'])
    .where('scan.id', '=', record.scan_id)
    .executeTakeFirstOrThrow();
  const form = scan.chart_form_id ? await chartFormsRepository.findChartFormById(db, scan.chart_form_id) : undefined;
  const other = await db
    .selectFrom('ink_line')
    .select('id')
    .where('scan_id', '=', record.scan_id)
    .where('id', '!=', inkLineId)
    .where('author_id', '!=', record.author_id)
    .where('status', 'in', ['handed_in', 'approved'])
    .orderBy('updated_at')
    .executeTakeFirst();
  const otherLine = other ? await readLine(db, other.id) : undefined;
  const fitted = await db
    .selectFrom('ink_line')
    .innerJoin('pin_set', 'pin_set.id', 'ink_line.pin_set_id')
    .select(['pin_set.fit', 'ink_line.result'])
    .where('ink_line.id', '=', inkLineId)
    .executeTakeFirstOrThrow();
  const agreements = other ? await findAgreements(db, [other.id]) : new Map();
  return {
    row,
    scan: { id: scan.id, widthPx: scan.width_px, heightPx: scan.height_px, status: scan.status, chartFormName: scan.chart_form_name },
    pinRmsLimit: form ? pinRmsLimit(form) : { hPa: 0, minutes: 0 },
    chartForm: form ? chartFormOf(form) : null,
    registration: { model: fitted.fit.model, paperToPixel: fitted.fit.paperToPixel, penArmRadiusMm: fitted.fit.penArmRadiusMm },
    corrections: reviewCorrectionsOf(fitted.result),
    line: (await readLine(db, inkLineId))!,
    history: await readHistory(db, inkLineId),
    crossTrace: otherLine ? { ...otherLine, agreement: agreements.get(otherLine.inkLineId) ?? null } : null,
  };
}
