import request from 'supertest';
import { API } from '@shared/api/routes';
import { SERIES_CSV_HEADER } from '@shared/api/series';
import {
  createChartForm,
  createInkLineWithPoints,
  createPerson,
  createScanRow,
  createStation,
  type TestPerson,
} from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

const SAVED_POINTS = [
  { time: '2026-03-01T23:00:00Z', pressureHpa: 1001.004 },
  { time: '2026-03-02T00:00:00Z', pressureHpa: 1000.456 },
  { time: '2026-03-02T01:00:00Z', pressureHpa: 999.996, flag: 'interpolated' as const },
  { time: '2026-03-02T23:00:00Z', pressureHpa: 987.1 },
  { time: '2026-03-03T00:00:00Z', pressureHpa: 986.25 },
];

describe('station series and CSV export', () => {
  let context: TestContext;
  let climatologist: TestPerson;
  let stationId: string;
  let inkLineId: string;

  function getCsv(query: Record<string, string>) {
    return request(context.app).get(API.seriesCsv).query(query).set('Authorization', `Bearer ${climatologist.token}`).buffer(true);
  }

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    climatologist = await createPerson(context.db, ['climatologist']);
    const volunteer = await createPerson(context.db, ['volunteer']);
    const station = await createStation(context.db, { code: 'KRX' });
    stationId = station.id;
    const otherStation = await createStation(context.db);
    const form = await createChartForm(context.db);
    const scanId = await createScanRow(context.db, { stationId, chartFormId: form.id, uploadedBy: volunteer.id, periodStart: '2026-03-01T00:00Z' });
    inkLineId = await createInkLineWithPoints(context.db, { scanId, stationId, authorId: volunteer.id, points: SAVED_POINTS });
    // A draft's points and another station's points must never show up.
    await createInkLineWithPoints(context.db, {
      scanId,
      stationId,
      authorId: volunteer.id,
      status: 'draft',
      points: [{ time: '2026-03-02T12:00:00Z', pressureHpa: 1111 }],
    });
    const otherScanId = await createScanRow(context.db, {
      stationId: otherStation.id,
      chartFormId: form.id,
      uploadedBy: volunteer.id,
      periodStart: '2026-03-01T00:00Z',
    });
    await createInkLineWithPoints(context.db, {
      scanId: otherScanId,
      stationId: otherStation.id,
      authorId: volunteer.id,
      points: [{ time: '2026-03-02T06:00:00Z', pressureHpa: 1022 }],
    });
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when the CSV is asked for a date range, then it has the header, ISO UTC times and the saved values to 2 decimals', async () => {
    const response = await getCsv({ stationId, from: '2026-03-02', to: '2026-03-02' });

    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(response.headers['content-disposition']).toBe('attachment; filename="KRX_2026-03-02_2026-03-02.csv"');
    const lines = response.text.trimEnd().split('\n');
    expect(lines[0]).toBe(SERIES_CSV_HEADER.join(','));
    expect(lines.slice(1)).toEqual([
      `2026-03-02T00:00:00.000Z,1000.46,ok,${inkLineId}`,
      `2026-03-02T01:00:00.000Z,1000.00,interpolated,${inkLineId}`,
      `2026-03-02T23:00:00.000Z,987.10,ok,${inkLineId}`,
    ]);
  });

  it('when the range is given as instants, then both ends are included', async () => {
    const response = await getCsv({ stationId, from: '2026-03-01T23:00:00Z', to: '2026-03-02T00:00:00Z' });

    const times = response.text.trimEnd().split('\n').slice(1).map((line) => line.split(',')[0]);
    expect(times).toEqual(['2026-03-01T23:00:00.000Z', '2026-03-02T00:00:00.000Z']);
  });

  it('when nothing lies in the range, then the CSV is the header alone', async () => {
    const response = await getCsv({ stationId, from: '2027-01-01', to: '2027-01-31' });

    expect(response.status).toBe(200);
    expect(response.text).toBe(`${SERIES_CSV_HEADER.join(',')}\n`);
  });

  it('when the JSON series is asked for, then the points come in time order with the range echoed', async () => {
    const response = await request(context.app)
      .get(API.series)
      .query({ stationId, from: '2026-03-01', to: '2026-03-03' })
      .set('Authorization', `Bearer ${climatologist.token}`);

    expect(response.status).toBe(200);
    expect(response.body).toEqual({
      stationId,
      from: '2026-03-01T00:00:00.000Z',
      to: '2026-03-03T23:59:59.999Z',
      truncated: false,
      points: SAVED_POINTS.map((point) => ({
        time: new Date(point.time).toISOString(),
        pressureHpa: point.pressureHpa,
        flag: point.flag ?? 'ok',
        inkLineId,
      })),
    });
  });

  it('when from is after to, then it answers 400 validation_failed for to', async () => {
    const response = await getCsv({ stationId, from: '2026-03-05', to: '2026-03-02' });

    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(response.body.error.details).toEqual({ to: 'to must not be before from' });
  });

  it('when the station id and dates are malformed, then it answers 400 naming each', async () => {
    const response = await request(context.app)
      .get(API.series)
      .query({ stationId: 'KRO', from: '2026-02-30', to: 'yesterday' })
      .set('Authorization', `Bearer ${climatologist.token}`);

    expect(response.status).toBe(400);
    expect(Object.keys(response.body.error.details).sort()).toEqual(['from', 'stationId', 'to']);
  });

  it('when an instant has no zone, then it is refused rather than read as local time', async () => {
    const response = await getCsv({ stationId, from: '2026-03-02T00:00:00', to: '2026-03-03' });

    expect(response.status).toBe(400);
    expect(response.body.error.details).toHaveProperty('from');
  });

  it('when the station does not exist, then it answers 404 station_not_found', async () => {
    const response = await getCsv({ stationId: '00000000-0000-4000-8000-000000000000', from: '2026-03-01', to: '2026-03-03' });

    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('station_not_found');
  });
});

describe('CSV export of a long series', () => {
  let context: TestContext;
  let teacher: TestPerson;
  let stationId: string;

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    teacher = await createPerson(context.db, ['teacher']);
    const volunteer = await createPerson(context.db, ['volunteer']);
    stationId = (await createStation(context.db)).id;
    const form = await createChartForm(context.db);
    const scanId = await createScanRow(context.db, { stationId, chartFormId: form.id, uploadedBy: volunteer.id, periodStart: '2020-01-01T00:00Z' });
    // 26 000 hourly points: more than the JSON limit and more than several read batches.
    const points = Array.from({ length: 26_000 }, (_, i) => ({
      time: new Date(Date.UTC(2020, 0, 1) + i * 3_600_000).toISOString(),
      pressureHpa: 1000 + (i % 100) / 10,
    }));
    for (let start = 0; start < points.length; start += 5000) {
      const lineScanId = start === 0 ? scanId : await createScanRow(context.db, { stationId, chartFormId: form.id, uploadedBy: volunteer.id, periodStart: '2020-01-01T00:00Z' });
      await createInkLineWithPoints(context.db, { scanId: lineScanId, stationId, authorId: volunteer.id, points: points.slice(start, start + 5000) });
    }
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when the range holds more points than the JSON limit, then the CSV has every one of them in time order', async () => {
    const response = await request(context.app)
      .get(API.seriesCsv)
      .query({ stationId, from: '2020-01-01', to: '2023-12-31' })
      .set('Authorization', `Bearer ${teacher.token}`)
      .buffer(true);

    expect(response.status).toBe(200);
    const lines = response.text.trimEnd().split('\n').slice(1);
    expect(lines).toHaveLength(26_000);
    const times = lines.map((line) => Date.parse(line.split(',')[0]));
    expect(times.every((time, i) => i === 0 || time - times[i - 1] === 3_600_000)).toBe(true);
    expect(lines[25_999].split(',')[1]).toBe((1000 + 99 / 10).toFixed(2));
  });

  it('when the JSON series is asked for the same range, then it stops at the limit and says it was truncated', async () => {
    const response = await request(context.app)
      .get(API.series)
      .query({ stationId, from: '2020-01-01', to: '2023-12-31' })
      .set('Authorization', `Bearer ${teacher.token}`);

    expect(response.status).toBe(200);
    expect(response.body.truncated).toBe(true);
    expect(response.body.points).toHaveLength(20_000);
  });
});
