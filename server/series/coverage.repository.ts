import { sql } from 'kysely';
import type { DbOrTrx } from '../db/database';

export interface CoverageMonthRow {
  month: string;
  pointCount: number;
  flaggedCount: number;
  minHpa: number | null;
  maxHpa: number | null;
}

/** Months with data, from the daily aggregates (a century is 36 525 rows, read by primary key). */
export async function readDataMonths(db: DbOrTrx, stationId: string): Promise<CoverageMonthRow[]> {
  const { rows } = await sql<{ month: string; point_count: number; flagged_count: number; min_hpa: number; max_hpa: number }>`
    select to_char(bucket_start at time zone 'UTC', 'YYYY-MM') as month, sum(point_count)::int as point_count,
      sum(flagged_count)::int as flagged_count, min(min_hpa) as min_hpa, max(max_hpa) as max_hpa
    from station_series_daily where station_id = ${stationId}
    group by 1 order by 1`.execute(db);
  return rows.map((row) => ({ month: row.month, pointCount: row.point_count, flaggedCount: row.flagged_count, minHpa: row.min_hpa, maxHpa: row.max_hpa }));
}

/** The station's scans by month of chart start and status; scans without a chart start under month null. */
export async function readChartMonths(db: DbOrTrx, stationId: string): Promise<{ month: string | null; status: string; count: number }[]> {
  const { rows } = await sql<{ month: string | null; status: string; count: number }>`
    select to_char(chart_start at time zone 'UTC', 'YYYY-MM') as month, status, count(*)::int as count
    from scan where station_id = ${stationId}
    group by 1, 2 order by 1, 2`.execute(db);
  return rows;
}

/** First and last time of the materialized series. */
export async function readSeriesEnds(db: DbOrTrx, stationId: string): Promise<{ first: Date | null; last: Date | null }> {
  const { rows } = await sql<{ first: Date | null; last: Date | null }>`
    select (select min(time) from station_series_point where station_id = ${stationId}) as first,
           (select max(time) from station_series_point where station_id = ${stationId}) as last`.execute(db);
  return rows[0] ?? { first: null, last: null };
}
