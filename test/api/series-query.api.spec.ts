import request from 'supertest';
import { NetCDFReader } from 'netcdfjs';
import { API } from '@shared/api/routes';
import { SERIES_FLAGS, type SeriesFlag } from '@shared/api/series';
import { SERIES_FLAG_MEANINGS } from '@shared/api/series-flags';
import { recordSeriesChanges } from '../../server/series/series-change';
import { buildAllPendingSeries } from '../../server/series/series-build';
import { FILL_DOUBLE } from '../../server/series/series-netcdf';
import { rebuildAggregates } from '../../server/series/station-series.repository';
import { createChartForm, createInkLineWithPoints, createPerson, createScanRow, createStation, type TestPerson } from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

const HOUR_MS = 3_600_000;
const START_MS = Date.UTC(2026, 2, 1);
/** 48 hourly points from 2026-03-01T00Z: 1000 + i hPa; point 5 interpolated, point 30 suspect. */
const POINTS = Array.from({ length: 48 }, (_, i) => ({
  time: new Date(START_MS + i * HOUR_MS).toISOString(),
  pressureHpa: 1000 + i,
  flag: (i === 5 ? 'interpolated' : i === 30 ? 'suspect' : 'ok') as SeriesFlag,
}));

/**
 * A byte variable as numbers. netcdfjs reads a variable's whole vsize, which the classic format pads to a
 * multiple of 4 bytes, and returns each byte in an array of its own: keep the dimension's length, flattened.
 */
function byteValues(file: NetCDFReader, name: string): number[] {
  const length = file.dimensions.find((dimension) => dimension.name === 'time')?.size ?? 0;
  return (file.getDataVariable(name) as unknown as number[][]).slice(0, length).flat();
}

/** A variable's attributes by name (netcdfjs types the list as empty, so it is read as what it holds). */
function attributesOf(file: NetCDFReader, name: string): Record<string, unknown> {
  const variable = file.variables.find((one) => one.name === name);
  if (!variable) throw new Error(`no variable ${name}`);
  return Object.fromEntries((variable.attributes as unknown as { name: string; value: unknown }[]).map((attribute) => [attribute.name, attribute.value]));
}

describe('series query: steps, aggregates, flags and formats', () => {
  let context: TestContext;
  let climatologist: TestPerson;
  let stationId: string;
  let otherStationId: string;
  let inkLineId: string;
  let scanId: string;
  let chartFormId: string;

  function query(params: Record<string, string | string[]>) {
    return request(context.app).get(API.seriesQuery).query(params).set('Authorization', `Bearer ${climatologist.token}`);
  }

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    climatologist = await createPerson(context.db, ['climatologist']);
    const volunteer = await createPerson(context.db, ['volunteer']);
    const station = await createStation(context.db, {
      code: 'QRY',
      name: 'Query Point',
      latitude: 60.25,
      longitude: 5.5,
      elevationM: 12,
      wigosId: '0-20000-0-01999',
      barometerHeightM: 14.5,
    });
    stationId = station.id;
    otherStationId = (await createStation(context.db, { code: 'QRZ' })).id;
    const form = await createChartForm(context.db);
    chartFormId = form.id;
    scanId = await createScanRow(context.db, { stationId, chartFormId: form.id, uploadedBy: volunteer.id, chartStart: '2026-03-01T00:00Z' });
    inkLineId = await createInkLineWithPoints(context.db, { scanId, stationId, authorId: volunteer.id, points: POINTS });
    const otherScan = await createScanRow(context.db, { stationId: otherStationId, chartFormId: form.id, uploadedBy: volunteer.id, chartStart: '2026-03-01T00:00Z' });
    await createInkLineWithPoints(context.db, { scanId: otherScan, stationId: otherStationId, authorId: volunteer.id, points: [{ time: POINTS[0].time, pressureHpa: 990 }] });
    await buildAllPendingSeries(context.db);
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when the raw step is asked for, then every merged point comes with its flag and ink line, and the version and build time', async () => {
    const response = await query({ stationId, from: '2026-03-01', to: '2026-03-02' });

    expect(response.status).toBe(200);
    expect(response.body.step).toBe('raw');
    expect(response.body.aggregate).toBeNull();
    const [series] = response.body.stations;
    expect(series).toMatchObject({ stationId, stationCode: 'QRY', version: 1 });
    expect(Date.parse(series.builtAt)).not.toBeNaN();
    expect(series.points).toHaveLength(48);
    expect(series.points[5]).toEqual({ time: POINTS[5].time, pressureHpa: 1005, flag: 'interpolated', uncertaintyHpa: null, inkLineId });
  });

  it('when the daily step is asked for, then each UTC day carries mean, min, max, count and the flagged share', async () => {
    const response = await query({ stationId, from: '2026-03-01', to: '2026-03-02', step: 'daily' });

    expect(response.status).toBe(200);
    // Day 1 holds 1000…1023 hPa: mean 1011.5; day 2 holds 1024…1047: mean 1035.5; one flagged point in each.
    expect(response.body.stations[0].points).toEqual([
      { time: '2026-03-01T00:00:00.000Z', pressureHpa: 1011.5, meanHpa: 1011.5, minHpa: 1000, maxHpa: 1023, count: 24, flaggedShare: 1 / 24, uncertaintyHpa: null },
      { time: '2026-03-02T00:00:00.000Z', pressureHpa: 1035.5, meanHpa: 1035.5, minHpa: 1024, maxHpa: 1047, count: 24, flaggedShare: 1 / 24, uncertaintyHpa: null },
    ]);
  });

  it('when the aggregate is max or min, then pressureHpa carries it', async () => {
    const max = await query({ stationId, from: '2026-03-01', to: '2026-03-02', step: 'daily', aggregate: 'max' });
    const min = await query({ stationId, from: '2026-03-01', to: '2026-03-02', step: 'monthly', aggregate: 'min' });

    expect(max.body.stations[0].points.map((bucket: { pressureHpa: number }) => bucket.pressureHpa)).toEqual([1023, 1047]);
    // The month of March holds all 48 points: min 1000, mean 1023.5, two flagged.
    expect(min.body.stations[0].points).toEqual([
      { time: '2026-03-01T00:00:00.000Z', pressureHpa: 1000, meanHpa: 1023.5, minHpa: 1000, maxHpa: 1047, count: 48, flaggedShare: 2 / 48, uncertaintyHpa: null },
    ]);
  });

  it('when the range starts mid-day, then the first day holds only the points inside the range', async () => {
    const response = await query({ stationId, from: '2026-03-01T12:00:00Z', to: '2026-03-01T23:59:59Z', step: 'daily' });

    // 12:00–23:00 is 1012…1023 hPa: mean 1017.5 of 12 points, none flagged.
    expect(response.body.stations[0].points).toEqual([
      { time: '2026-03-01T00:00:00.000Z', pressureHpa: 1017.5, meanHpa: 1017.5, minHpa: 1012, maxHpa: 1023, count: 12, flaggedShare: 0, uncertaintyHpa: null },
    ]);
  });

  it('when every flag is named, then the buckets grouped from the points equal the stored buckets, uncertainty included', async () => {
    // Naming every flag takes the path that groups the points at query time; no flag filter reads the stored hours
    // and days with their stored JSON (server/series/bucket-json.ts). Both must give the same answer.
    const pointTime = new Date(POINTS[2].time);
    const day = { fromMs: Date.parse('2026-03-01T00:00:00Z'), toMs: Date.parse('2026-03-01T23:59:59Z') };
    await context.db.updateTable('station_series_point').set({ uncertainty_hpa: 0.3 }).where('time', '=', pointTime).execute();
    await rebuildAggregates(context.db, stationId, day);
    try {
      for (const step of ['hourly', 'daily', 'monthly']) {
        const stored = await query({ stationId, from: '2026-03-01', to: '2026-03-02', step });
        const grouped = await query({ stationId, from: '2026-03-01', to: '2026-03-02', step, flags: SERIES_FLAGS.join(',') });

        expect(stored.status).toBe(200);
        expect(grouped.body.stations[0].points).toEqual(stored.body.stations[0].points);
      }
      const hourly = await query({ stationId, from: '2026-03-01', to: '2026-03-01', step: 'hourly' });
      expect(hourly.body.stations[0].points[2]).toMatchObject({ time: POINTS[2].time, uncertaintyHpa: 0.3 });
    } finally {
      await context.db.updateTable('station_series_point').set({ uncertainty_hpa: null }).where('time', '=', pointTime).execute();
      await rebuildAggregates(context.db, stationId, day);
    }
  });

  it('when hourly and 10min steps are asked for, then each point is its own bucket', async () => {
    const hourly = await query({ stationId, from: '2026-03-01', to: '2026-03-01', step: 'hourly' });
    const tenMinutes = await query({ stationId, from: '2026-03-01T00:00:00Z', to: '2026-03-01T02:00:00Z', step: '10min' });

    expect(hourly.body.stations[0].points).toHaveLength(24);
    expect(hourly.body.stations[0].points[5]).toMatchObject({ time: POINTS[5].time, meanHpa: 1005, count: 1, flaggedShare: 1 });
    expect(tenMinutes.body.stations[0].points.map((bucket: { time: string }) => bucket.time)).toEqual([POINTS[0].time, POINTS[1].time, POINTS[2].time]);
  });

  it('when flags are excluded or chosen, then the buckets and points leave the others out', async () => {
    const excluded = await query({ stationId, from: '2026-03-02', to: '2026-03-02', step: 'daily', excludeFlags: 'suspect' });
    const chosen = await query({ stationId, from: '2026-03-01', to: '2026-03-02', flags: 'interpolated,suspect' });

    // Day 2 without point 30 (1030 hPa): 23 points summing to 24 × 1035.5 − 1030.
    const [day] = excluded.body.stations[0].points;
    expect(day.count).toBe(23);
    expect(day.meanHpa).toBeCloseTo((24 * 1035.5 - 1030) / 23, 9);
    expect(day.flaggedShare).toBe(0);
    expect(excluded.body.flags).toEqual(SERIES_FLAGS.filter((flag) => flag !== 'suspect'));
    expect(chosen.body.stations[0].points.map((point: { pressureHpa: number }) => point.pressureHpa)).toEqual([1005, 1030]);
  });

  it('when several stations are asked for in JSON, then each comes with its own version and points', async () => {
    const response = await query({ stationId: [stationId, otherStationId], from: '2026-03-01', to: '2026-03-01', step: 'daily' });

    expect(response.status).toBe(200);
    expect(response.body.stations.map((series: { stationCode: string }) => series.stationCode)).toEqual(['QRY', 'QRZ']);
    expect(response.body.stations[1].points).toEqual([expect.objectContaining({ meanHpa: 990, count: 1 })]);
  });

  it('when provenance is asked for, then each raw point names its scan, chart form and chart start', async () => {
    const response = await query({ stationId, from: '2026-03-01T00:00:00Z', to: '2026-03-01T00:00:00Z', provenance: 'true' });

    expect(response.body.stations[0].points[0].provenance).toEqual({ scanId, chartFormId, chartFormName: expect.any(String), chartStart: '2026-03-01T00:00:00.000Z' });
  });

  it('when the range is too long for the step, then it answers 400 series_range_too_large with the limit and a coarser step', async () => {
    const response = await query({ stationId, from: '1900-01-01', to: '1999-12-31', step: 'hourly' });

    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('series_range_too_large');
    // 100 000 rows of an hour: 4 166 days.
    expect(response.body.error.details).toEqual({ step: 'hourly', maxRangeDays: 4166, suggestedStep: 'daily' });
    expect(response.body.error.message).toContain('4,166 days');
  });

  it('when the parameters are wrong, then it answers 400 naming each', async () => {
    const raw = await query({ stationId, from: '2026-03-01', to: '2026-03-02', aggregate: 'max' });
    const both = await query({ stationId, from: '2026-03-01', to: '2026-03-02', step: 'daily', flags: 'ok', excludeFlags: 'suspect' });
    const bad = await query({ stationId: 'nope', from: 'x', to: '2026-03-02', step: 'weekly', flags: 'dubious' });
    const netcdfTwo = await query({ stationId: [stationId, otherStationId], from: '2026-03-01', to: '2026-03-02', format: 'netcdf' });

    expect(raw.body.error.details).toEqual({ aggregate: 'aggregate applies to steps coarser than raw' });
    expect(both.body.error.details).toEqual({ excludeFlags: 'give flags or excludeFlags, not both' });
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['flags', 'from', 'stationId.0', 'step']);
    expect(bad.body.error.details.flags).toContain('dubious');
    expect(netcdfTwo.status).toBe(400);
    expect(netcdfTwo.body.error.details).toHaveProperty('stationId');
  });

  it('when CSV is asked for, then a commented header names the station, units, flags, version, licence and citation before the rows', async () => {
    const response = await query({ stationId: [stationId, otherStationId], from: '2026-03-01', to: '2026-03-01', step: 'daily', format: 'csv' }).buffer(true);

    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(response.headers['content-disposition']).toBe('attachment; filename="QRY+QRZ_2026-03-01_2026-03-01_daily.csv"');
    const lines = response.text.trimEnd().split('\n');
    const comments = lines.filter((line) => line.startsWith('#'));
    const rows = lines.filter((line) => !line.startsWith('#'));
    expect(comments).toEqual(
      expect.arrayContaining([
        '# station QRY: Query Point',
        '#   wigos_id: 0-20000-0-01999',
        '#   latitude: 60.25 degrees_north (WGS 84)',
        '#   longitude: 5.5 degrees_east (WGS 84)',
        '#   elevation: 12 m above mean sea level',
        '#   barometer_height: 14.5 m above mean sea level',
        '#   series_version: 1',
        `# flag suspect: ${SERIES_FLAG_MEANINGS.suspect}`,
      ]),
    );
    expect(comments.some((line) => line.startsWith('# licence: CC BY 4.0'))).toBe(true);
    expect(comments.some((line) => line.startsWith('#   cite as: Isallo barogram archive: station series of Query Point (QRY), version 1'))).toBe(true);
    expect(comments.some((line) => line.startsWith('# units: time ISO 8601 UTC; pressure hPa'))).toBe(true);
    expect(rows).toEqual([
      'station_code,time,pressure_hpa,mean_hpa,min_hpa,max_hpa,count,flagged_share,uncertainty_hpa',
      'QRY,2026-03-01T00:00:00.000Z,1011.50,1011.50,1000.00,1023.00,24,0.042,',
      'QRZ,2026-03-01T00:00:00.000Z,990.00,990.00,990.00,990.00,1,0.000,',
    ]);
  });

  it('when NetCDF is asked for, then netcdfjs reads a CF-1.10 timeSeries with air_pressure in hPa, its uncertainty and its flag', async () => {
    // Give one point an uncertainty, so the file holds both a value and a fill.
    await context.db.updateTable('station_series_point').set({ uncertainty_hpa: 0.25 }).where('time', '=', new Date(POINTS[1].time)).execute();
    const response = await query({ stationId, from: '2026-03-01T00:00:00Z', to: '2026-03-01T05:00:00Z', format: 'netcdf' })
      .buffer(true)
      .parse((res, callback) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => callback(null, Buffer.concat(chunks)));
      });

    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('application/x-netcdf');
    const file = new NetCDFReader(response.body as Buffer);
    expect(file.version).toBe('classic format');
    const global = (name: string) => file.getAttribute(name);
    expect(global('Conventions')).toBe('CF-1.10');
    expect(global('featureType')).toBe('timeSeries');
    expect(global('isallo_series_version')).toBe(1);
    expect(String(global('license'))).toContain('CC BY 4.0');
    const attributes = (variable: string) => attributesOf(file, variable);
    expect(attributes('air_pressure')).toMatchObject({
      standard_name: 'air_pressure',
      units: 'hPa',
      ancillary_variables: 'air_pressure_uncertainty air_pressure_flag',
      coordinates: 'time lat lon alt station_id',
      cell_methods: 'time: point',
    });
    expect(attributes('air_pressure_uncertainty')).toMatchObject({ standard_name: 'air_pressure standard_error', units: 'hPa' });
    expect(attributes('air_pressure_flag')).toMatchObject({ standard_name: 'air_pressure status_flag', flag_meanings: SERIES_FLAGS.join(' ') });
    expect(Array.from(attributes('air_pressure_flag').flag_values as number[])).toEqual([0, 1, 2, 3, 4]);
    expect(attributes('station_id')).toMatchObject({ cf_role: 'timeseries_id' });
    expect(attributes('time')).toMatchObject({ standard_name: 'time', units: 'seconds since 1970-01-01 00:00:00', calendar: 'standard' });
    expect(attributes('lat')).toMatchObject({ standard_name: 'latitude', units: 'degrees_north' });
    expect(attributes('lon')).toMatchObject({ standard_name: 'longitude', units: 'degrees_east' });

    expect(Array.from(file.getDataVariable('time') as number[])).toEqual(POINTS.slice(0, 6).map((point) => Date.parse(point.time) / 1000));
    expect(Array.from(file.getDataVariable('air_pressure') as number[])).toEqual([1000, 1001, 1002, 1003, 1004, 1005]);
    expect(Array.from(file.getDataVariable('air_pressure_uncertainty') as number[])).toEqual([FILL_DOUBLE, 0.25, FILL_DOUBLE, FILL_DOUBLE, FILL_DOUBLE, FILL_DOUBLE]);
    // Point 5 is interpolated: index 1 in flag_values order.
    expect(byteValues(file, 'air_pressure_flag')).toEqual([0, 0, 0, 0, 0, 1]);
    expect(file.getDataVariable('lat')).toEqual([60.25]);
    expect(file.getDataVariable('lon')).toEqual([5.5]);
    expect(file.getDataVariable('alt')).toEqual([14.5]);
    // netcdfjs returns a char variable one character per element.
    expect((file.getDataVariable('station_id') as unknown as string[]).join('')).toBe('0-20000-0-01999');
  });

  it('when NetCDF is asked for at a daily step, then the cell method names the aggregate and each day counts its readings', async () => {
    const response = await query({ stationId, from: '2026-03-01', to: '2026-03-02', step: 'daily', aggregate: 'max', format: 'netcdf' })
      .buffer(true)
      .parse((res, callback) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => callback(null, Buffer.concat(chunks)));
      });

    const file = new NetCDFReader(response.body as Buffer);
    expect(attributesOf(file, 'air_pressure').cell_methods).toBe('time: maximum');
    expect(Array.from(file.getDataVariable('air_pressure') as number[])).toEqual([1023, 1047]);
    expect(Array.from(file.getDataVariable('point_count') as number[])).toEqual([24, 24]);
    expect(byteValues(file, 'air_pressure_flag')).toEqual([1, 1]);
  });

  it('when NetCDF is asked for a range without points, then it answers 404 series_empty and no file', async () => {
    const response = await query({ stationId, from: '2027-01-01', to: '2027-01-02', format: 'netcdf' });

    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('series_empty');
  });

  it('when the coverage is asked for, then it gives the months with data and the charts by state', async () => {
    const response = await request(context.app).get(API.stationCoverage(stationId)).set('Authorization', `Bearer ${climatologist.token}`);

    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({
      stationId,
      version: 1,
      first: POINTS[0].time,
      last: POINTS[47].time,
      pointCount: 48,
      chartCount: 1,
      chartStates: { ready_to_trace: 1 },
      months: [{ month: '2026-03', pointCount: 48, flaggedShare: 2 / 48, minHpa: 1000, maxHpa: 1047, chartCount: 1, chartStates: { ready_to_trace: 1 } }],
    });
  });
});

describe('building the station series from series_change', () => {
  let context: TestContext;
  let climatologist: TestPerson;
  let volunteer: TestPerson;
  let stationId: string;
  let formId: string;

  async function stateOf(id: string) {
    return context.db.selectFrom('station_series_state').selectAll().where('station_id', '=', id).executeTakeFirst();
  }

  async function addLine(fromIso: string, pressures: number[]) {
    const scanId = await createScanRow(context.db, { stationId, chartFormId: formId, uploadedBy: volunteer.id, chartStart: fromIso });
    const fromMs = Date.parse(fromIso);
    return createInkLineWithPoints(context.db, {
      scanId,
      stationId,
      authorId: volunteer.id,
      points: pressures.map((pressureHpa, i) => ({ time: new Date(fromMs + i * HOUR_MS).toISOString(), pressureHpa })),
    });
  }

  beforeAll(async () => {
    context = await createTestContext();
  });

  beforeEach(async () => {
    await truncateTables(context.db);
    climatologist = await createPerson(context.db, ['climatologist']);
    volunteer = await createPerson(context.db, ['volunteer']);
    stationId = (await createStation(context.db)).id;
    formId = (await createChartForm(context.db)).id;
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when a line leaves the series, then the build rebuilds only its span, the version rises and the aggregates follow', async () => {
    await addLine('2026-01-05T00:00:00Z', [1000, 1001, 1002]);
    const leaving = await addLine('2026-06-01T00:00:00Z', [990, 991]);
    const [first] = await buildAllPendingSeries(context.db);
    expect(first).toMatchObject({ stationId, version: 2, changeCount: 2, pointCount: 5 });

    await context.db.updateTable('ink_line').set({ status: 'returned' }).where('id', '=', leaving).execute();
    await recordSeriesChanges(context.db, [{ stationId, inkLineId: leaving, change: 'removed', personId: null, reason: 'returned: test' }]);
    const [second] = await buildAllPendingSeries(context.db);

    // Only the June line's two hours were rebuilt; January's points stay as they were.
    expect(second).toMatchObject({ version: 3, changeCount: 1, pointCount: 0 });
    expect(second.spans).toEqual([{ fromMs: Date.parse('2026-06-01T00:00:00Z'), toMs: Date.parse('2026-06-01T01:00:00Z') }]);
    const points = await context.db.selectFrom('station_series_point').select('pressure_hpa').where('station_id', '=', stationId).orderBy('time').execute();
    expect(points.map((row) => row.pressure_hpa)).toEqual([1000, 1001, 1002]);
    const days = await context.db.selectFrom('station_series_daily').select(['bucket_start', 'mean_hpa']).where('station_id', '=', stationId).execute();
    expect(days).toEqual([{ bucket_start: new Date('2026-01-05T00:00:00Z'), mean_hpa: 1001 }]);
    const hours = await context.db.selectFrom('station_series_hourly').select((eb) => eb.fn.countAll<number>().as('n')).where('station_id', '=', stationId).executeTakeFirstOrThrow();
    expect(Number(hours.n)).toBe(3);
    expect((await stateOf(stationId))?.version).toBe(3);
  });

  it('when nothing changed since the last build, then a build does nothing and the version stays', async () => {
    await addLine('2026-01-05T00:00:00Z', [1000]);
    await buildAllPendingSeries(context.db);
    const before = await stateOf(stationId);

    const results = await buildAllPendingSeries(context.db);

    expect(results).toEqual([]);
    expect(await stateOf(stationId)).toEqual(before);
  });

  it('when an ink line is deleted, then its change (ink line gone) rebuilds the whole station', async () => {
    const gone = await addLine('2026-01-05T00:00:00Z', [1000, 1001]);
    await addLine('2026-02-05T00:00:00Z', [1005]);
    await buildAllPendingSeries(context.db);

    await context.db.deleteFrom('ink_line').where('id', '=', gone).execute();
    // What a deletion records: the line is gone, so its row names no ink line (the foreign key sets it null).
    await context.db.insertInto('series_change').values({ station_id: stationId, ink_line_id: null, change: 'removed', person_id: null, reason: 'ink line deleted' }).execute();
    const [rebuilt] = await buildAllPendingSeries(context.db);

    // The whole station is rebuilt (January's old points were still shown), and only February is left.
    expect(rebuilt.spans).toEqual([{ fromMs: Date.parse('2026-01-05T00:00:00Z'), toMs: Date.parse('2026-02-05T00:00:00Z') }]);
    const points = await context.db.selectFrom('station_series_point').select('pressure_hpa').where('station_id', '=', stationId).execute();
    expect(points.map((row) => row.pressure_hpa)).toEqual([1005]);
  });

  it('when the worker runs, then it builds a station with unread changes without anyone reading it', async () => {
    await addLine('2026-01-05T00:00:00Z', [1000, 1001]);
    const worker = await context.startWorker();
    try {
      const deadline = Date.now() + 30_000;
      let state = await stateOf(stationId);
      while ((state?.version ?? 0) < 1 && Date.now() < deadline) {
        await new Promise((resolve) => setTimeout(resolve, 200));
        state = await stateOf(stationId);
      }

      expect(state?.version).toBe(1);
      const points = await context.db.selectFrom('station_series_point').select('pressure_hpa').where('station_id', '=', stationId).execute();
      expect(points).toHaveLength(2);
    } finally {
      await worker.stop();
    }
  }, 40_000);

  it('when a reader asks before the job has run, then the read builds first and sees the change', async () => {
    await addLine('2026-01-05T00:00:00Z', [1000, 1001]);

    const response = await request(context.app)
      .get(API.seriesQuery)
      .query({ stationId, from: '2026-01-05', to: '2026-01-05', step: 'hourly' })
      .set('Authorization', `Bearer ${climatologist.token}`);

    expect(response.body.stations[0]).toMatchObject({ version: 1, points: [expect.objectContaining({ meanHpa: 1000 }), expect.objectContaining({ meanHpa: 1001 })] });
  });
});
