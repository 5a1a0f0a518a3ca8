import { stringify } from 'csv-stringify/sync';
import { SERIES_FLAGS } from '@shared/api/series';
import { SERIES_FLAG_MEANINGS, SERIES_LICENCE, seriesCitation } from '@shared/api/series-flags';
import type { RawSeriesPoint, SeriesBucket, StationSeries } from '@shared/api/series-query';
import type { StationSummary } from '@shared/api/stations';
import type { SeriesQuery } from './parse-series-query';

export const RAW_CSV_COLUMNS = ['station_code', 'time', 'pressure_hpa', 'flag', 'uncertainty_hpa', 'ink_line_id'] as const;
export const BUCKET_CSV_COLUMNS = [
  'station_code',
  'time',
  'pressure_hpa',
  'mean_hpa',
  'min_hpa',
  'max_hpa',
  'count',
  'flagged_share',
  'uncertainty_hpa',
] as const;

const orBlank = (value: number | string | null) => (value === null ? '' : String(value));

/**
 * The commented header of a series CSV: `# key: value` lines that pandas (`comment='#'`) and R
 * (`comment.char = '#'`) skip, naming each station, the units, the flags, the version and how to cite.
 */
export function seriesCsvHeader(query: SeriesQuery, stations: readonly StationSummary[], series: readonly StationSeries[], accessedAt: string): string {
  const lines = [
    'Isallo station series: station pressure digitized from paper barograph charts',
    `range: ${new Date(query.fromMs).toISOString()} to ${new Date(query.toMs).toISOString()} (inclusive, UTC)`,
    `step: ${query.step}${query.step === 'raw' ? '' : `; pressure_hpa is the ${query.aggregate} of each UTC bucket, time its start`}`,
    `flags included: ${(query.flags ?? SERIES_FLAGS).join(', ')}`,
  ];
  stations.forEach((station, index) => {
    const version = series[index];
    lines.push(
      `station ${station.code}: ${station.name}`,
      `  wigos_id: ${orBlank(station.wigosId)}`,
      `  latitude: ${orBlank(station.latitude)} degrees_north (WGS 84)`,
      `  longitude: ${orBlank(station.longitude)} degrees_east (WGS 84)`,
      `  elevation: ${orBlank(station.elevationM)} m above mean sea level`,
      `  barometer_height: ${orBlank(station.barometerHeightM)} m above mean sea level`,
      `  series_version: ${version.version}`,
      `  built_at: ${orBlank(version.builtAt)}`,
      `  cite as: ${seriesCitation(station.name, station.code, version.version, version.builtAt, accessedAt)}`,
    );
  });
  lines.push(
    'units: time ISO 8601 UTC; pressure hPa, station pressure at the barometer (not reduced to sea level); uncertainty_hpa the standard uncertainty (1 sigma), hPa',
    ...(query.step === 'raw'
      ? []
      : ['count: points in the bucket; flagged_share: share of them whose flag is not ok; uncertainty_hpa: mean of their uncertainties']),
    ...SERIES_FLAGS.map((flag) => `flag ${flag}: ${SERIES_FLAG_MEANINGS[flag]}`),
    `licence: ${SERIES_LICENCE}`,
  );
  return lines.map((line) => `# ${line}\n`).join('');
}

export function seriesCsvColumnLine(query: SeriesQuery): string {
  return stringify([query.step === 'raw' ? [...RAW_CSV_COLUMNS] : [...BUCKET_CSV_COLUMNS]]);
}

/** CSV rows of one station's points or buckets, hPa to 2 decimals (0.01 hPa is finer than any barograph). */
export function seriesCsvRows(stationCode: string, points: RawSeriesPoint[] | SeriesBucket[], isRaw: boolean): string {
  const hpa = (value: number | null) => (value === null ? '' : value.toFixed(2));
  if (isRaw) {
    return stringify((points as RawSeriesPoint[]).map((point) => [stationCode, point.time, hpa(point.pressureHpa), point.flag, hpa(point.uncertaintyHpa), point.inkLineId]));
  }
  return stringify(
    (points as SeriesBucket[]).map((bucket) => [
      stationCode,
      bucket.time,
      hpa(bucket.pressureHpa),
      hpa(bucket.meanHpa),
      hpa(bucket.minHpa),
      hpa(bucket.maxHpa),
      bucket.count,
      bucket.flaggedShare.toFixed(3),
      hpa(bucket.uncertaintyHpa),
    ]),
  );
}

/** `KRO_1890-01-01_1899-12-31_hourly.csv` (or `KRO+OSL_…` for several stations), safe for Content-Disposition. */
export function seriesFileName(stationCodes: readonly string[], query: SeriesQuery, extension: 'csv' | 'nc'): string {
  const codes = stationCodes.map((code) => code.replace(/[^A-Za-z0-9_-]/g, '_')).join('+');
  const day = (ms: number) => new Date(ms).toISOString().slice(0, 10);
  return `${codes}_${day(query.fromMs)}_${day(query.toMs)}_${query.step}.${extension}`;
}
