import { sql, type RawBuilder } from 'kysely';
import type { SeriesFlag } from '@shared/api/series';
import type { PointProvenance, RawSeriesPoint, SeriesAggregate, SeriesBucket, SeriesStep } from '@shared/api/series-query';
import type { DbOrTrx } from '../db/database';
import { BUCKET_JSON_TAIL } from './bucket-json';

/** One station over an inclusive range, with the flags its points may carry (null: every flag). */
export interface SeriesReadQuery {
  stationId: string;
  fromMs: number;
  toMs: number;
  flags: readonly SeriesFlag[] | null;
}

type BucketRow = {
  bucket_start: Date;
  mean_hpa: number;
  min_hpa: number;
  max_hpa: number;
  point_count: number;
  flagged_count: number;
  mean_uncertainty_hpa: number | null;
  /** The bucket's answer JSON less its pressureHpa: stored for whole hours and days, written here otherwise. */
  bucket_json: string;
};

const EPOCH = sql`timestamptz '1970-01-01 00:00:00+00'`;

function flagCondition(flags: readonly SeriesFlag[] | null): RawBuilder<unknown> {
  return flags === null ? sql`true` : sql`flag = any(${[...flags]}::text[])`;
}

/** The merged points of the range in time order; with provenance, each point's scan and chart form. */
export async function readRawPoints(db: DbOrTrx, query: SeriesReadQuery, withProvenance: boolean, limit?: number): Promise<RawSeriesPoint[]> {
  const { rows } = await sql<{
    time: Date;
    pressure_hpa: number;
    uncertainty_hpa: number | null;
    flag: SeriesFlag;
    ink_line_id: string;
    scan_id: string | null;
    chart_form_id: string | null;
    chart_form_name: string | null;
    chart_start: Date | null;
  }>`
    select p.time, p.pressure_hpa, p.uncertainty_hpa, p.flag, p.ink_line_id,
      ${withProvenance ? sql`s.id as scan_id, s.chart_form_id, f.name as chart_form_name, s.chart_start` : sql`null as scan_id`}
    from station_series_point p
    ${withProvenance ? sql`left join ink_line l on l.id = p.ink_line_id left join scan s on s.id = l.scan_id left join chart_form f on f.id = s.chart_form_id` : sql``}
    where p.station_id = ${query.stationId} and p.time >= ${new Date(query.fromMs)} and p.time <= ${new Date(query.toMs)} and ${flagCondition(query.flags)}
    order by p.time ${limit === undefined ? sql`` : sql`limit ${limit}`}`.execute(db);
  return rows.map((row) => {
    const point: RawSeriesPoint = {
      time: row.time.toISOString(),
      pressureHpa: row.pressure_hpa,
      flag: row.flag,
      uncertaintyHpa: row.uncertainty_hpa,
      inkLineId: row.ink_line_id,
    };
    if (withProvenance && row.scan_id) {
      const provenance: PointProvenance = {
        scanId: row.scan_id,
        chartFormId: row.chart_form_id,
        chartFormName: row.chart_form_name,
        chartStart: row.chart_start ? row.chart_start.toISOString() : null,
      };
      point.provenance = provenance;
    }
    return point;
  });
}

/** SQL that groups the materialized points (optionally only some flags) into buckets of the step. */
function bucketsFromPoints(query: SeriesReadQuery, bucket: RawBuilder<unknown>): RawBuilder<BucketRow> {
  return withBucketJson(sql`
    select ${bucket} as bucket_start, avg(pressure_hpa) as mean_hpa, min(pressure_hpa) as min_hpa, max(pressure_hpa) as max_hpa,
      count(*)::int as point_count, (count(*) filter (where flag <> 'ok'))::int as flagged_count, avg(uncertainty_hpa) as mean_uncertainty_hpa
    from station_series_point
    where station_id = ${query.stationId} and time >= ${new Date(query.fromMs)} and time <= ${new Date(query.toMs)} and ${flagCondition(query.flags)}
    group by 1`);
}

/** Buckets computed at query time, with the JSON text that stored buckets keep. */
function withBucketJson(buckets: RawBuilder<unknown>): RawBuilder<BucketRow> {
  return sql<BucketRow>`select computed.*, ${BUCKET_JSON_TAIL} as bucket_json from (${buckets}) computed`;
}

/** Bucket sizes of the steps; a month is a calendar month in UTC. */
const POINT_BUCKETS: Record<Exclude<SeriesStep, 'raw'>, RawBuilder<unknown>> = {
  '10min': sql`date_bin(interval '10 minutes', time, ${EPOCH})`,
  hourly: sql`date_bin(interval '1 hour', time, ${EPOCH})`,
  daily: sql`date_bin(interval '1 day', time, ${EPOCH})`,
  monthly: sql`(date_trunc('month', time at time zone 'UTC') at time zone 'UTC')`,
};

/**
 * The buckets of the range. Hourly and daily with every flag come straight from the stored aggregates,
 * monthly with every flag from the daily ones (weighted by their counts); the rest is grouped from the points.
 * A bucket holds the points of the range that fall in it, so the first and last may be partial.
 */
export async function readBuckets(db: DbOrTrx, query: SeriesReadQuery, step: Exclude<SeriesStep, 'raw'>, aggregate: SeriesAggregate): Promise<SeriesBucket[]> {
  const { rows } = await bucketsStatement(query, step).execute(db);
  return rows.map((row) => toBucket(row, aggregate));
}

/** The SQL of readBuckets (the benchmark EXPLAINs it). */
export function bucketsStatement(query: SeriesReadQuery, step: Exclude<SeriesStep, 'raw'>): RawBuilder<BucketRow> {
  let statement: RawBuilder<BucketRow>;
  if (query.flags === null && (step === 'hourly' || step === 'daily')) {
    statement = sql<BucketRow>`select * from (${storedBuckets(query, step)}) b order by bucket_start`;
  } else if (query.flags === null && step === 'monthly') {
    const months = withBucketJson(sql`
      select (date_trunc('month', bucket_start at time zone 'UTC') at time zone 'UTC') as bucket_start,
        sum(mean_hpa * point_count) / sum(point_count) as mean_hpa, min(min_hpa) as min_hpa, max(max_hpa) as max_hpa,
        sum(point_count)::int as point_count, sum(flagged_count)::int as flagged_count,
        sum(mean_uncertainty_hpa * point_count) filter (where mean_uncertainty_hpa is not null)
          / nullif(sum(point_count) filter (where mean_uncertainty_hpa is not null), 0) as mean_uncertainty_hpa
      from (${storedBuckets(query, 'daily')}) days
      group by 1`);
    statement = sql<BucketRow>`select * from (${months}) m order by bucket_start`;
  } else {
    statement = sql<BucketRow>`select * from (${bucketsFromPoints(query, POINT_BUCKETS[step])}) b order by bucket_start`;
  }
  return statement;
}

/**
 * Hourly or daily buckets of the range with every flag: the buckets wholly inside it from the stored
 * aggregates, the partial ones at either end grouped from the points (so no point outside the range counts).
 */
function storedBuckets(query: SeriesReadQuery, step: 'hourly' | 'daily'): RawBuilder<BucketRow> {
  const table = step === 'hourly' ? 'station_series_hourly' : 'station_series_daily';
  const bucketMs = step === 'hourly' ? 3_600_000 : 86_400_000;
  const firstWhole = Math.ceil(query.fromMs / bucketMs) * bucketMs;
  const endWhole = Math.floor((query.toMs + 1) / bucketMs) * bucketMs;
  if (endWhole <= firstWhole) return bucketsFromPoints(query, POINT_BUCKETS[step]);
  const stored = sql<BucketRow>`
    select bucket_start, mean_hpa, min_hpa, max_hpa, point_count, flagged_count, mean_uncertainty_hpa, bucket_json
    from ${sql.table(table)} where station_id = ${query.stationId} and bucket_start >= ${new Date(firstWhole)} and bucket_start < ${new Date(endWhole)}`;
  const parts = [stored];
  if (firstWhole > query.fromMs) parts.unshift(bucketsFromPoints({ ...query, toMs: firstWhole - 1 }, POINT_BUCKETS[step]));
  if (endWhole <= query.toMs) parts.push(bucketsFromPoints({ ...query, fromMs: endWhole }, POINT_BUCKETS[step]));
  return parts.length === 1 ? stored : sql<BucketRow>`${sql.join(parts.map((part) => sql`(${part})`), sql` union all `)}`;
}

function toBucket(row: BucketRow, aggregate: SeriesAggregate): SeriesBucket {
  const meanHpa = Number(row.mean_hpa);
  const minHpa = Number(row.min_hpa);
  const maxHpa = Number(row.max_hpa);
  return {
    time: new Date(row.bucket_start).toISOString(),
    pressureHpa: aggregate === 'min' ? minHpa : aggregate === 'max' ? maxHpa : meanHpa,
    meanHpa,
    minHpa,
    maxHpa,
    count: Number(row.point_count),
    flaggedShare: Number(row.point_count) === 0 ? 0 : Number(row.flagged_count) / Number(row.point_count),
    uncertaintyHpa: row.mean_uncertainty_hpa === null ? null : Number(row.mean_uncertainty_hpa),
  };
}

const STREAM_BATCH_ROWS = 5000;

/** The merged points of the range in keyset batches, so an export of any length holds one batch in memory. */
export async function* streamRawPoints(db: DbOrTrx, query: SeriesReadQuery): AsyncGenerator<RawSeriesPoint[]> {
  let fromMs = query.fromMs;
  for (;;) {
    const batch = await readRawPoints(db, { ...query, fromMs }, false, STREAM_BATCH_ROWS);
    if (batch.length > 0) yield batch;
    if (batch.length < STREAM_BATCH_ROWS) return;
    fromMs = Date.parse(batch[batch.length - 1].time) + 1;
  }
}

const ISO_UTC = `'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"'`;

/**
 * The buckets of readBuckets as one JSON array text joined by PostgreSQL from each bucket's JSON (bucket-json.ts):
 * a century of days is one value instead of 36 500 parsed rows and dates.
 */
export async function readBucketsJson(db: DbOrTrx, query: SeriesReadQuery, step: Exclude<SeriesStep, 'raw'>, aggregate: SeriesAggregate): Promise<string> {
  const { rows } = await bucketsJsonStatement(query, step, aggregate).execute(db);
  return rows[0].points;
}

/** The SQL of readBucketsJson (the benchmark EXPLAINs it). */
export function bucketsJsonStatement(query: SeriesReadQuery, step: Exclude<SeriesStep, 'raw'>, aggregate: SeriesAggregate): RawBuilder<{ points: string }> {
  const chosen = aggregate === 'min' ? sql`min_hpa` : aggregate === 'max' ? sql`max_hpa` : sql`mean_hpa`;
  return sql<{ points: string }>`
    select coalesce('[' || string_agg(concat('{"pressureHpa":', ${chosen}, ',', bucket_json), ',' order by bucket_start) || ']', '[]') as points
    from (${bucketsStatement(query, step)}) b`;
}

/** The raw points of readRawPoints (no provenance) as one JSON array text built by PostgreSQL. */
export async function readRawPointsJson(db: DbOrTrx, query: SeriesReadQuery): Promise<string> {
  const { rows } = await sql<{ points: string }>`
    select coalesce(json_agg(json_build_object(
      'time', to_char(time at time zone 'UTC', ${sql.raw(ISO_UTC)}), 'pressureHpa', pressure_hpa, 'flag', flag,
      'uncertaintyHpa', uncertainty_hpa, 'inkLineId', ink_line_id) order by time), '[]')::text as points
    from station_series_point
    where station_id = ${query.stationId} and time >= ${new Date(query.fromMs)} and time <= ${new Date(query.toMs)} and ${flagCondition(query.flags)}`.execute(db);
  return rows[0].points;
}
