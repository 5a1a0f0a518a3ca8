import { SERIES_FLAGS } from '@shared/api/series';
import { SERIES_LICENCE, seriesCitation } from '@shared/api/series-flags';
import type { RawSeriesPoint, SeriesBucket, StationSeries } from '@shared/api/series-query';
import type { StationSummary } from '@shared/api/stations';
import { type NcAttribute, type NcVariable, writeNetcdfClassic } from '@shared/netcdf/netcdf-classic-writer';
import type { SeriesQuery } from './parse-series-query';

/** NetCDF's default fill value of a double (netcdf.h NC_FILL_DOUBLE), used for unknown values. */
export const FILL_DOUBLE = 9.969209968386869e36;
const text = (name: string, value: string): NcAttribute => ({ name, type: 'char', value });
const double = (name: string, ...value: number[]): NcAttribute => ({ name, type: 'double', value });

const CELL_METHOD = { mean: 'mean', min: 'minimum', max: 'maximum' } as const;
/** Bucket flags: whether every point of the bucket was ok. */
const BUCKET_FLAG_MEANINGS = 'all_points_ok some_points_flagged';

/**
 * One station's series as a CF-1.10 NetCDF classic file: a discrete sampling geometry of featureType
 * timeSeries, single-station form (CF Conventions 1.10, Appendix H.2, "a single time series": the station
 * coordinates as scalars, the series along `time`). Station pressure is `air_pressure` in hPa; its standard
 * uncertainty (`air_pressure standard_error`) and its flag (`status_flag`, flag_values / flag_meanings) are
 * ancillary variables. At a bucketed step, cell_methods names the aggregate and the flag says whether every
 * point in the bucket was ok.
 */
export function seriesNetcdf(station: StationSummary, series: StationSeries, query: SeriesQuery, createdAt: string): Uint8Array {
  const isRaw = query.step === 'raw';
  const points = series.points as (RawSeriesPoint | SeriesBucket)[];
  // A dimension needs a length of at least 1; an empty series is refused before it gets here.
  const count = points.length;
  const stationId = station.wigosId ?? station.code;
  const orFill = (value: number | null) => (value === null ? FILL_DOUBLE : value);

  const flagValues = isRaw ? SERIES_FLAGS.map((_, index) => index) : [0, 1];
  const flagData = points.map((point) =>
    isRaw ? SERIES_FLAGS.indexOf((point as RawSeriesPoint).flag) : (point as SeriesBucket).flaggedShare > 0 ? 1 : 0,
  );
  const coordinates = text('coordinates', 'time lat lon alt station_id');

  const variables: NcVariable[] = [
    {
      name: 'station_id',
      type: 'char',
      dimensions: ['id_strlen'],
      attributes: [text('cf_role', 'timeseries_id'), text('long_name', station.wigosId ? 'WIGOS station identifier' : 'Isallo station code')],
      data: stationId,
    },
    { name: 'station_name', type: 'char', dimensions: ['name_strlen'], attributes: [text('long_name', 'station name')], data: station.name },
    {
      name: 'lat',
      type: 'double',
      dimensions: [],
      attributes: [text('standard_name', 'latitude'), text('long_name', 'station latitude'), text('units', 'degrees_north'), double('_FillValue', FILL_DOUBLE)],
      data: [orFill(station.latitude)],
    },
    {
      name: 'lon',
      type: 'double',
      dimensions: [],
      attributes: [text('standard_name', 'longitude'), text('long_name', 'station longitude'), text('units', 'degrees_east'), double('_FillValue', FILL_DOUBLE)],
      data: [orFill(station.longitude)],
    },
    {
      name: 'alt',
      type: 'double',
      dimensions: [],
      attributes: [
        text('standard_name', 'altitude'),
        text('long_name', 'height of the barometer above mean sea level'),
        text('units', 'm'),
        text('positive', 'up'),
        text('axis', 'Z'),
        double('_FillValue', FILL_DOUBLE),
      ],
      data: [orFill(station.barometerHeightM ?? station.elevationM)],
    },
    {
      name: 'time',
      type: 'double',
      dimensions: ['time'],
      attributes: [
        text('standard_name', 'time'),
        text('long_name', isRaw ? 'time of the reading' : 'start of the UTC bucket'),
        text('units', 'seconds since 1970-01-01 00:00:00'),
        text('calendar', 'standard'),
        text('axis', 'T'),
      ],
      data: points.map((point) => Date.parse(point.time) / 1000),
    },
    {
      name: 'air_pressure',
      type: 'double',
      dimensions: ['time'],
      attributes: [
        text('standard_name', 'air_pressure'),
        text('long_name', 'station pressure at the barometer, digitized from barograph charts'),
        text('units', 'hPa'),
        double('_FillValue', FILL_DOUBLE),
        coordinates,
        text('ancillary_variables', 'air_pressure_uncertainty air_pressure_flag'),
        text('cell_methods', isRaw ? 'time: point' : `time: ${CELL_METHOD[query.aggregate]}`),
      ],
      data: points.map((point) => point.pressureHpa),
    },
    {
      name: 'air_pressure_uncertainty',
      type: 'double',
      dimensions: ['time'],
      attributes: [
        text('standard_name', 'air_pressure standard_error'),
        text('long_name', isRaw ? 'standard uncertainty (1 sigma) of the reading' : 'mean standard uncertainty (1 sigma) of the bucket’s readings'),
        text('units', 'hPa'),
        double('_FillValue', FILL_DOUBLE),
        coordinates,
      ],
      data: points.map((point) => orFill(point.uncertaintyHpa)),
    },
    {
      name: 'air_pressure_flag',
      type: 'byte',
      dimensions: ['time'],
      attributes: [
        text('standard_name', 'air_pressure status_flag'),
        text('long_name', isRaw ? 'quality flag of the reading' : 'whether every reading in the bucket was ok'),
        { name: 'flag_values', type: 'byte', value: flagValues },
        text('flag_meanings', isRaw ? SERIES_FLAGS.join(' ') : BUCKET_FLAG_MEANINGS),
        coordinates,
      ],
      data: flagData,
    },
  ];
  if (!isRaw) {
    variables.push({
      name: 'point_count',
      type: 'int',
      dimensions: ['time'],
      attributes: [text('long_name', 'readings in the bucket'), text('units', '1'), coordinates],
      data: points.map((point) => (point as SeriesBucket).count),
    });
  }

  const nameLength = Math.max(1, new TextEncoder().encode(station.name).length);
  const idLength = Math.max(1, new TextEncoder().encode(stationId).length);
  return writeNetcdfClassic({
    dimensions: [
      { name: 'time', length: count },
      { name: 'id_strlen', length: idLength },
      { name: 'name_strlen', length: nameLength },
    ],
    attributes: [
      text('Conventions', 'CF-1.10'),
      text('featureType', 'timeSeries'),
      text('title', `Station pressure at ${station.name} (${station.code}), ${query.step}`),
      text('institution', 'Isallo barogram archive'),
      text('source', 'paper barograph charts (barograms), pen lines traced and registered by volunteers'),
      text('history', `${createdAt} written by Isallo from series version ${series.version}`),
      text('license', SERIES_LICENCE),
      text('references', seriesCitation(station.name, station.code, series.version, series.builtAt, createdAt)),
      text('time_coverage_start', new Date(query.fromMs).toISOString()),
      text('time_coverage_end', new Date(query.toMs).toISOString()),
      { name: 'isallo_series_version', type: 'int', value: [series.version] },
      text('isallo_series_built_at', series.builtAt ?? ''),
      text('isallo_step', query.step),
    ],
    variables,
  });
}
