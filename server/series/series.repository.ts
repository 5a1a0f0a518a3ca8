import type { SeriesFlag } from '@shared/api/series';
import type { DbOrTrx } from '../db/database';
import { inkLineCountsInSeries } from './series-membership';

export interface NewSeriesPoint {
  timeMs: number;
  pressureHpa: number;
  uncertaintyHpa: number | null;
  flag: SeriesFlag;
}

// 6 parameters a row keeps one insert far below Postgres's 65 535 bind parameters.
const INSERT_BATCH_ROWS = 2000;
const READ_BATCH_ROWS = 5000;


export async function insertSeriesPoints(db: DbOrTrx, inkLineId: string, stationId: string, points: NewSeriesPoint[]): Promise<void> {
  for (let start = 0; start < points.length; start += INSERT_BATCH_ROWS) {
    const batch = points.slice(start, start + INSERT_BATCH_ROWS);
    await db
      .insertInto('series_point')
      .values(
        batch.map((point) => ({
          ink_line_id: inkLineId,
          station_id: stationId,
          time: new Date(point.timeMs),
          pressure_hpa: point.pressureHpa,
          uncertainty_hpa: point.uncertaintyHpa,
          flag: point.flag,
        })),
      )
      .execute();
  }
}

export interface SeriesRange {
  stationId: string;
  fromMs: number;
  /** Inclusive end of the range, epoch ms. */
  toMs: number;
}

function selectPublishedPoints(db: DbOrTrx, range: SeriesRange) {
  return db
    .selectFrom('series_point')
    .innerJoin('ink_line', 'ink_line.id', 'series_point.ink_line_id')
    .innerJoin('scan', 'scan.id', 'ink_line.scan_id')
    .select(['series_point.time', 'series_point.pressure_hpa', 'series_point.uncertainty_hpa', 'series_point.flag', 'series_point.ink_line_id'])
    .where('series_point.station_id', '=', range.stationId)
    .where('series_point.time', '>=', new Date(range.fromMs))
    .where('series_point.time', '<=', new Date(range.toMs))
    .where('series_point.pressure_hpa', 'is not', null)
    // Only approved lines of scans that are not withdrawn (series-membership.ts).
    .where(inkLineCountsInSeries);
}

/** One stored point of one ink line, as read for merging. */
export interface StoredSeriesPoint {
  inkLineId: string;
  timeMs: number;
  pressureHpa: number;
  uncertaintyHpa: number | null;
  flag: SeriesFlag;
}

type PointRow = { time: Date; pressure_hpa: number | null; uncertainty_hpa: number | null; flag: SeriesFlag; ink_line_id: string };

function toStoredPoint(row: PointRow): StoredSeriesPoint {
  return {
    inkLineId: row.ink_line_id,
    timeMs: row.time.getTime(),
    pressureHpa: row.pressure_hpa as number,
    uncertaintyHpa: row.uncertainty_hpa,
    flag: row.flag,
  };
}

/**
 * Every stored point of the range's published ink lines, in time order, read in keyset batches of about
 * READ_BATCH_ROWS rows. Each batch holds whole times (every ink line's point at a time comes in the same
 * batch), so a batch can be merged on its own and an export of any length holds one batch in memory.
 */
export async function* streamStoredPoints(db: DbOrTrx, range: SeriesRange): AsyncGenerator<StoredSeriesPoint[]> {
  let afterTime: Date | null = null;
  for (;;) {
    let query = selectPublishedPoints(db, range);
    if (afterTime) query = query.where('series_point.time', '>', afterTime);
    const rows = await query.orderBy('series_point.time').orderBy('series_point.ink_line_id').limit(READ_BATCH_ROWS).execute();
    if (rows.length < READ_BATCH_ROWS) {
      if (rows.length > 0) yield rows.map(toStoredPoint);
      return;
    }
    // The last time may go on past the limit: hold it back for the next batch.
    const lastTime = rows[rows.length - 1].time;
    let whole = rows.filter((row) => row.time.getTime() < lastTime.getTime());
    if (whole.length === 0) {
      // One time filled the whole batch (thousands of ink lines at one hour): read that time alone.
      whole = await selectPublishedPoints(db, range).where('series_point.time', '=', lastTime).orderBy('series_point.ink_line_id').execute();
    }
    yield whole.map(toStoredPoint);
    afterTime = whole[whole.length - 1].time;
  }
}

/** The span of one ink line's chart, UTC epoch ms: the scan's chart on / chart off, or else the line's first / last point. */
export interface InkLineSpan {
  inkLineId: string;
  startMs: number;
  endMs: number;
}

/** The spans of the given ink lines (all of their stored points count, not only those in a range). */
export async function findInkLineSpans(db: DbOrTrx, inkLineIds: readonly string[]): Promise<InkLineSpan[]> {
  if (inkLineIds.length === 0) return [];
  const rows = await db
    .selectFrom('ink_line')
    .innerJoin('scan', 'scan.id', 'ink_line.scan_id')
    .select(['ink_line.id', 'scan.chart_on', 'scan.chart_off'])
    .select((eb) => [
      eb
        .selectFrom('series_point')
        .whereRef('series_point.ink_line_id', '=', 'ink_line.id')
        .select((sub) => sub.fn.min('series_point.time').as('time'))
        .as('first_time'),
      eb
        .selectFrom('series_point')
        .whereRef('series_point.ink_line_id', '=', 'ink_line.id')
        .select((sub) => sub.fn.max('series_point.time').as('time'))
        .as('last_time'),
    ])
    .where('ink_line.id', 'in', inkLineIds)
    .execute();
  return rows.flatMap((row) => {
    const start = row.chart_on ?? row.first_time;
    const end = row.chart_off ?? row.last_time;
    // A line without points has no span, and it has no points to merge either.
    return start && end ? [{ inkLineId: row.id, startMs: new Date(start).getTime(), endMs: new Date(end).getTime() }] : [];
  });
}
