/** Quality of one series point (see GLOSSARY.md). */
export const SERIES_FLAGS = ['ok', 'interpolated', 'gap', 'off_scale', 'suspect'] as const;
export type SeriesFlag = (typeof SERIES_FLAGS)[number];

export interface SeriesPoint {
  /** ISO 8601 UTC instant. */
  time: string;
  pressureHpa: number;
  flag: SeriesFlag;
  inkLineId: string;
}

export interface SeriesResponse {
  stationId: string;
  from: string;
  to: string;
  points: SeriesPoint[];
  /** True when more points exist in the range than `limit` allowed; narrow the range. */
  truncated: boolean;
}

/** Largest number of points one series request returns; the CSV export streams without this cap. */
export const SERIES_POINT_LIMIT = 20000;

/** The CSV header the export writes, in order. */
export const SERIES_CSV_HEADER = ['time', 'pressure_hpa', 'flag', 'ink_line_id'] as const;
