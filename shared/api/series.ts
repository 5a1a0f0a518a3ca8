/** Quality of one series point (see GLOSSARY.md). */
export const SERIES_FLAGS = ['ok', 'interpolated', 'gap', 'off_scale', 'suspect'] as const;
export type SeriesFlag = (typeof SERIES_FLAGS)[number];

export interface SeriesPoint {
  /** ISO 8601 UTC instant. */
  time: string;
  pressureHpa: number;
  flag: SeriesFlag;
  /** Standard uncertainty (1σ) of pressureHpa, hPa; null when none is known (an off-scale bound, or an older trace). */
  uncertaintyHpa: number | null;
  /** The ink line this point was taken from (provenance); where several cover the time, the chosen one. */
  inkLineId: string;
}

export interface SeriesResponse {
  stationId: string;
  from: string;
  to: string;
  /** The station series: one point per time, in time order. */
  points: SeriesPoint[];
  /** True when more points exist in the range than `limit` allowed; narrow the range. */
  truncated: boolean;
  /** How many ink lines these points were taken from. */
  sourceCount: number;
  /** The series version these points are from: it rises by one with every ink line entering or leaving the series. */
  version: number;
  /** When that version was built (ISO 8601 UTC); null before the station's first build. */
  builtAt: string | null;
}

/** Largest number of points one series request returns; the CSV export streams without this cap. */
export const SERIES_POINT_LIMIT = 20000;

/** The CSV header the export writes, in order. */
export const SERIES_CSV_HEADER = ['time', 'pressure_hpa', 'flag', 'uncertainty_hpa', 'ink_line_id'] as const;
