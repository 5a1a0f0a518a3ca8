import type { SeriesFlag, SeriesPoint } from '@shared/api/series';
import type { DbOrTrx } from '../db/database';

export interface NewSeriesPoint {
  timeMs: number;
  pressureHpa: number;
  uncertaintyHpa: number | null;
  flag: SeriesFlag;
}

// 6 parameters a row keeps one insert far below Postgres's 65 535 bind parameters.
const INSERT_BATCH_ROWS = 2000;
const READ_BATCH_ROWS = 5000;
// Only handed-in and approved lines belong to a station series; drafts and returned lines do not.
const PUBLISHED_INK_LINE_STATUSES = ['handed_in', 'approved'] as const;

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
    .select(['series_point.time', 'series_point.pressure_hpa', 'series_point.flag', 'series_point.ink_line_id'])
    .where('series_point.station_id', '=', range.stationId)
    .where('series_point.time', '>=', new Date(range.fromMs))
    .where('series_point.time', '<=', new Date(range.toMs))
    .where('series_point.pressure_hpa', 'is not', null)
    .where('ink_line.status', 'in', PUBLISHED_INK_LINE_STATUSES);
}

type PointRow = { time: Date; pressure_hpa: number | null; flag: SeriesFlag; ink_line_id: string };

function toSeriesPoint(row: PointRow): SeriesPoint {
  return { time: row.time.toISOString(), pressureHpa: row.pressure_hpa as number, flag: row.flag, inkLineId: row.ink_line_id };
}

/** Up to `limit` points of the range in time order. */
export async function findSeriesPoints(db: DbOrTrx, range: SeriesRange, limit: number): Promise<SeriesPoint[]> {
  const rows = await selectPublishedPoints(db, range)
    .orderBy('series_point.time')
    .orderBy('series_point.ink_line_id')
    .limit(limit)
    .execute();
  return rows.map(toSeriesPoint);
}

/**
 * Every point of the range in time order, read in keyset batches so that an export of any length
 * holds one batch in memory at a time.
 */
export async function* streamSeriesPoints(db: DbOrTrx, range: SeriesRange): AsyncGenerator<SeriesPoint[]> {
  let after: { time: Date; inkLineId: string } | null = null;
  for (;;) {
    let query = selectPublishedPoints(db, range);
    if (after) {
      const { time, inkLineId } = after;
      query = query.where((eb) =>
        eb.or([
          eb('series_point.time', '>', time),
          eb.and([eb('series_point.time', '=', time), eb('series_point.ink_line_id', '>', inkLineId)]),
        ]),
      );
    }
    const rows = await query.orderBy('series_point.time').orderBy('series_point.ink_line_id').limit(READ_BATCH_ROWS).execute();
    if (rows.length === 0) return;
    yield rows.map(toSeriesPoint);
    if (rows.length < READ_BATCH_ROWS) return;
    const last = rows[rows.length - 1];
    after = { time: last.time, inkLineId: last.ink_line_id };
  }
}
