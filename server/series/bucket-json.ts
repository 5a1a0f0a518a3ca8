import { sql } from 'kysely';

/**
 * The JSON of one bucket of GET /api/series/query, less its leading `{"pressureHpa":…,` (which depends on the
 * aggregate asked for): `"time":"…","meanHpa":…,…,"uncertaintyHpa":…}`. It is written once per stored hour
 * and day when the aggregates are rebuilt, so a query of a century of days only joins stored text instead of
 * formatting 36 500 timestamps and 200 000 numbers on every request (json_build_object took 60 ms for a
 * year of hours). float8 goes out in its shortest exact form, as JSON.stringify writes a number.
 * The expression reads the columns of an aggregate row: bucket_start, mean_hpa, min_hpa, max_hpa,
 * point_count, flagged_count, mean_uncertainty_hpa.
 */
export const BUCKET_JSON_TAIL = sql<string>`concat(
  '"time":"', to_char(bucket_start at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"'),
  '","meanHpa":', mean_hpa, ',"minHpa":', min_hpa, ',"maxHpa":', max_hpa, ',"count":', point_count,
  ',"flaggedShare":', case when point_count = 0 then 0 else flagged_count::float8 / point_count end,
  ',"uncertaintyHpa":', coalesce(mean_uncertainty_hpa::text, 'null'), '}')`;
