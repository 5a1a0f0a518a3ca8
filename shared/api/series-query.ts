import { z } from 'zod';
import { SERIES_FLAGS } from './series';

/** Steps a series can be asked for: the merged points as they are, or buckets of 10 minutes, an hour, a UTC day or a UTC month. */
export const SERIES_STEPS = ['raw', '10min', 'hourly', 'daily', 'monthly'] as const;
export type SeriesStep = (typeof SERIES_STEPS)[number];

/** Which value of a bucket `pressureHpa` carries; every bucket also carries the other two. */
export const SERIES_AGGREGATES = ['mean', 'min', 'max'] as const;
export type SeriesAggregate = (typeof SERIES_AGGREGATES)[number];

export const SERIES_FORMATS = ['json', 'csv', 'netcdf'] as const;
export type SeriesFormat = (typeof SERIES_FORMATS)[number];

/** Most stations one request may name (JSON and CSV; NetCDF takes one). */
export const SERIES_MAX_STATIONS = 10;
/** Most rows one request may answer, summed over its stations: a decade of hourly buckets for one station fits. */
export const SERIES_MAX_ROWS = 100_000;

/**
 * The spacing each step is counted at against SERIES_MAX_ROWS. Raw points are hourly as traces are read
 * today (server/ink-lines/ink-line-reading.ts); raw is counted at 10 minutes so a finer reading later still fits.
 */
export const SERIES_STEP_NOMINAL_MS: Record<SeriesStep, number> = {
  raw: 600_000,
  '10min': 600_000,
  hourly: 3_600_000,
  daily: 86_400_000,
  // The shortest month, so the count is never under-estimated.
  monthly: 28 * 86_400_000,
};

/** The longest range (ms) a request may span at a step for the given number of stations. */
export function maxSeriesRangeMs(step: SeriesStep, stationCount: number): number {
  return Math.floor(SERIES_MAX_ROWS / Math.max(1, stationCount)) * SERIES_STEP_NOMINAL_MS[step];
}

/** The finest step whose limit admits the range; null when even monthly does not. */
export function finestStepFor(rangeMs: number, stationCount: number): SeriesStep | null {
  return SERIES_STEPS.find((step) => rangeMs <= maxSeriesRangeMs(step, stationCount)) ?? null;
}

const flagList = z
  .string()
  .transform((value, context) => {
    const flags = value.split(',').map((flag) => flag.trim()).filter((flag) => flag !== '');
    const unknown = flags.filter((flag) => !(SERIES_FLAGS as readonly string[]).includes(flag));
    if (unknown.length > 0) context.addIssue({ code: 'custom', message: `unknown flag(s): ${unknown.join(', ')}; the flags are ${SERIES_FLAGS.join(', ')}` });
    return flags as (typeof SERIES_FLAGS)[number][];
  })
  .meta({ description: `Comma-separated flags (${SERIES_FLAGS.join(', ')}).`, example: 'ok,interpolated' });

const stationIds = z
  .union([z.string(), z.array(z.string())])
  .transform((value) => (Array.isArray(value) ? value : value.split(',')).map((id) => id.trim()).filter((id) => id !== ''))
  .pipe(
    z
      .array(z.uuid({ message: 'stationId must be a station id' }))
      .min(1, 'stationId is required')
      .max(SERIES_MAX_STATIONS, `at most ${SERIES_MAX_STATIONS} stations in one request`),
  )
  .meta({ description: `One station id, or several (repeated or comma-separated, at most ${SERIES_MAX_STATIONS}; JSON and CSV only).` });

/** The query of GET /api/series/query (times are checked by the server's time parser, see parse-series-query.ts). */
export const seriesQuerySchema = z.strictObject({
  stationId: stationIds,
  from: z.string().meta({ description: 'Start: a UTC date (YYYY-MM-DD) or an ISO 8601 instant with Z or an offset.', example: '1890-01-01' }),
  to: z.string().meta({ description: 'End, inclusive: a date includes its whole UTC day.', example: '1899-12-31' }),
  step: z.enum(SERIES_STEPS).default('raw').meta({ description: 'raw, 10min, hourly, daily or monthly (UTC buckets).' }),
  aggregate: z.enum(SERIES_AGGREGATES).optional().meta({ description: 'Which bucket value pressureHpa carries (default mean); not for step raw.' }),
  flags: flagList.optional().meta({ description: 'Only points with these flags (default: every flag).' }),
  excludeFlags: flagList.optional().meta({ description: 'Leave out points with these flags. Not together with flags.' }),
  format: z.enum(SERIES_FORMATS).default('json').meta({ description: 'json, csv, or netcdf (CF-1.10 NetCDF classic; one station).' }),
  provenance: z
    .enum(['true', 'false'])
    .default('false')
    .transform((value) => value === 'true')
    .meta({ description: 'raw step: add each point’s scan, chart form and chart start (JSON).' }),
});
export type SeriesQueryInput = z.input<typeof seriesQuerySchema>;

const flagSchema = z.enum(SERIES_FLAGS);

/** Where a raw point came from: its ink line, the scan it was traced on and that scan's chart form. */
export const pointProvenanceSchema = z
  .object({
    scanId: z.uuid(),
    chartFormId: z.uuid().nullable(),
    chartFormName: z.string().nullable(),
    chartStart: z.string().nullable().meta({ description: 'ISO 8601 UTC: the chart start of the scan.' }),
  })
  .meta({ id: 'PointProvenance' });
export type PointProvenance = z.infer<typeof pointProvenanceSchema>;

/** A raw point of a station series. */
export const rawSeriesPointSchema = z
  .object({
    time: z.string().meta({ description: 'ISO 8601 UTC instant.' }),
    pressureHpa: z.number().meta({ description: 'Station pressure, hPa.' }),
    flag: flagSchema,
    uncertaintyHpa: z.number().nullable().meta({ description: 'Standard uncertainty (1σ), hPa; null when none is known.' }),
    inkLineId: z.uuid().meta({ description: 'The ink line the point was taken from.' }),
    provenance: pointProvenanceSchema.optional(),
  })
  .meta({ id: 'RawSeriesPoint' });
export type RawSeriesPoint = z.infer<typeof rawSeriesPointSchema>;

/** One bucket of a station series at a step coarser than raw. */
export const seriesBucketSchema = z
  .object({
    time: z.string().meta({ description: 'ISO 8601 UTC start of the bucket.' }),
    pressureHpa: z.number().meta({ description: 'The asked-for aggregate of the bucket, hPa.' }),
    meanHpa: z.number(),
    minHpa: z.number(),
    maxHpa: z.number(),
    count: z.number().int().meta({ description: 'Points in the bucket.' }),
    flaggedShare: z.number().min(0).max(1).meta({ description: 'Share of the bucket’s points whose flag is not ok.' }),
    uncertaintyHpa: z
      .number()
      .nullable()
      .meta({ description: 'Mean of the points’ standard uncertainties, hPa (not reduced by averaging: neighbouring readings of one trace share their errors).' }),
  })
  .meta({ id: 'SeriesBucket' });
export type SeriesBucket = z.infer<typeof seriesBucketSchema>;

export const stationSeriesSchema = z
  .object({
    stationId: z.uuid(),
    stationCode: z.string(),
    stationName: z.string(),
    version: z.number().int().meta({ description: 'Series version: rises by one with every ink line entering or leaving the series.' }),
    builtAt: z.string().nullable().meta({ description: 'When this version was built (ISO 8601 UTC); null before the first build.' }),
    points: z.array(z.union([rawSeriesPointSchema, seriesBucketSchema])).meta({ description: 'RawSeriesPoint for step raw, SeriesBucket otherwise; in time order.' }),
  })
  .meta({ id: 'StationSeries' });
export type StationSeries = Omit<z.infer<typeof stationSeriesSchema>, 'points'> & { points: RawSeriesPoint[] | SeriesBucket[] };

export const seriesQueryResponseSchema = z
  .object({
    from: z.string(),
    to: z.string(),
    step: z.enum(SERIES_STEPS),
    aggregate: z.enum(SERIES_AGGREGATES).nullable(),
    flags: z.array(flagSchema).meta({ description: 'The flags the points were taken from.' }),
    stations: z.array(stationSeriesSchema),
  })
  .meta({ id: 'SeriesQueryResponse' });
export type SeriesQueryResponse = Omit<z.infer<typeof seriesQueryResponseSchema>, 'stations'> & { stations: StationSeries[] };

/** Coverage of one station: what exists, month by month, before anyone asks for a range. */
export const coverageMonthSchema = z
  .object({
    month: z.string().meta({ description: 'YYYY-MM (UTC).' }),
    pointCount: z.number().int(),
    flaggedShare: z.number().min(0).max(1),
    minHpa: z.number().nullable(),
    maxHpa: z.number().nullable(),
    chartCount: z.number().int().meta({ description: 'Scans whose chart starts in the month.' }),
    chartStates: z.record(z.string(), z.number().int()).meta({ description: 'Those scans by status.' }),
  })
  .meta({ id: 'CoverageMonth' });
export type CoverageMonth = z.infer<typeof coverageMonthSchema>;

export const stationCoverageSchema = z
  .object({
    stationId: z.uuid(),
    version: z.number().int(),
    builtAt: z.string().nullable(),
    first: z.string().nullable().meta({ description: 'First time with data, ISO 8601 UTC.' }),
    last: z.string().nullable(),
    pointCount: z.number().int(),
    chartCount: z.number().int(),
    chartStates: z.record(z.string(), z.number().int()),
    months: z.array(coverageMonthSchema).meta({ description: 'Months with data or with charts, in order.' }),
  })
  .meta({ id: 'StationCoverage' });
export type StationCoverage = z.infer<typeof stationCoverageSchema>;
