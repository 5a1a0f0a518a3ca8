import type { Generated } from 'kysely';
import type { SeriesFlag } from '@shared/api/series';

/** One point of the materialized station series: the merged point at one time (see series-build.ts). */
export interface StationSeriesPointTable {
  station_id: string;
  time: Date;
  pressure_hpa: number;
  uncertainty_hpa: number | null;
  flag: SeriesFlag;
  /** The ink line the merge chose at this time (provenance). */
  ink_line_id: string;
}

/** One hour or one UTC day of the materialized series (station_series_hourly, station_series_daily). */
export interface StationSeriesAggregateTable {
  station_id: string;
  /** Start of the hour or of the UTC day. */
  bucket_start: Date;
  mean_hpa: number;
  min_hpa: number;
  max_hpa: number;
  point_count: number;
  /** Points whose flag is not `ok`. */
  flagged_count: number;
  /** Mean of the points' standard uncertainties; null when none is known. */
  mean_uncertainty_hpa: number | null;
  /** The bucket's answer JSON less its pressureHpa (bucket-json.ts), written with the aggregates. */
  bucket_json: string;
}

/** Per station: the series version, when it was last built, and the last series_change row the build has read. */
export interface StationSeriesStateTable {
  station_id: string;
  version: Generated<number>;
  built_at: Generated<Date | null>;
  /** bigserial id of series_change (int8 is read as a number, see create-db.ts). */
  last_change_id: Generated<number>;
}
