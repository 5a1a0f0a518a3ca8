import request from 'supertest';
import { API } from '@shared/api/routes';
import { SERIES_CSV_HEADER } from '@shared/api/series';
import {
  createChartForm,
  createInkLineWithPoints,
  createPerson,
  createScanRow,
  createStation,
  TEST_WEEKLY_FORM,
  type TestPerson,
} from '../helpers/factories';
import { buildAllPendingSeries } from '../../server/series/series-build';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';
import { syntheticDraft } from '../helpers/trace';

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
    const scanId = await createScanRow(context.db, { stationId, chartFormId: form.id, uploadedBy: volunteer.id, chartStart: '2026-03-01T00:00Z' });
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
      chartStart: '2026-03-01T00:00Z',
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
    // These points were stored without an uncertainty, so its cell is empty.
    expect(lines.slice(1)).toEqual([
      `2026-03-02T00:00:00.000Z,1000.46,ok,,${inkLineId}`,
      `2026-03-02T01:00:00.000Z,1000.00,interpolated,,${inkLineId}`,
      `2026-03-02T23:00:00.000Z,987.10,ok,,${inkLineId}`,
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
      sourceCount: 1,
      // Two ink lines were recorded entering the series (the draft too: the build leaves out lines that do not count).
      version: 2,
      builtAt: expect.any(String),
      points: SAVED_POINTS.map((point) => ({
        time: new Date(point.time).toISOString(),
        pressureHpa: point.pressureHpa,
        flag: point.flag ?? 'ok',
        uncertaintyHpa: null,
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

  it('when an instant can be read with day and month either way round, then it is refused saying so', async () => {
    const response = await getCsv({ stationId, from: '02/03/2026 00:00', to: '2026-03-03' });

    expect(response.status).toBe(400);
    expect(response.body.error.details.from).toMatch(/day and month either way round/);
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
    const scanId = await createScanRow(context.db, { stationId, chartFormId: form.id, uploadedBy: volunteer.id, chartStart: '2020-01-01T00:00Z' });
    // 26 000 hourly points: more than the JSON limit and more than several read batches. Each ink line runs
    // three hours into the next one's, as consecutive charts overlap at a chart change.
    const points = Array.from({ length: 26_000 }, (_, i) => ({
      time: new Date(Date.UTC(2020, 0, 1) + i * 3_600_000).toISOString(),
      pressureHpa: 1000 + (i % 100) / 10,
    }));
    for (let start = 0; start < points.length; start += 5000) {
      const lineScanId = start === 0 ? scanId : await createScanRow(context.db, { stationId, chartFormId: form.id, uploadedBy: volunteer.id, chartStart: '2020-01-01T00:00Z' });
      await createInkLineWithPoints(context.db, { scanId: lineScanId, stationId, authorId: volunteer.id, points: points.slice(start, start + 5003) });
    }
    // Build the materialized series now (a read would otherwise build it first); 26 000 rows take a few seconds.
    await buildAllPendingSeries(context.db);
  }, 60_000);

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when the range holds more points than the JSON limit, then the CSV has every time once, in time order', async () => {
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
    // Points 0–19 999 come from the first four ink lines (the fourth runs to 20 002); the fifth starts after the cut.
    expect(response.body.sourceCount).toBe(4);
  });
});

describe('merging overlapping ink lines into one station series', () => {
  let context: TestContext;
  let climatologist: TestPerson;
  let volunteer: TestPerson;
  let stationId: string;
  let formId: string;

  function getSeries(from: string, to: string) {
    return request(context.app).get(API.series).query({ stationId, from, to }).set('Authorization', `Bearer ${climatologist.token}`);
  }

  /** Hourly points of one ink line from `fromIso`, one pressure (hPa) per hour, each with the given uncertainty. */
  async function createLine(scan: { chartOn?: string; chartOff?: string }, fromIso: string, pressuresHpa: number[], uncertaintyHpa: number | null) {
    const scanId = await createScanRow(context.db, { stationId, chartFormId: formId, uploadedBy: volunteer.id, chartStart: scan.chartOn ?? fromIso, ...scan });
    const fromMs = Date.parse(fromIso);
    const points = pressuresHpa.map((pressureHpa, i) => ({ time: new Date(fromMs + i * 3_600_000).toISOString(), pressureHpa }));
    const id = await createInkLineWithPoints(context.db, { scanId, stationId, authorId: volunteer.id, points });
    // The factory stores no uncertainty; give this line's points the one the case needs.
    await context.db.updateTable('series_point').set({ uncertainty_hpa: uncertaintyHpa }).where('ink_line_id', '=', id).execute();
    return id;
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

  // Merge rule: project design, see shared/domain/merge-series.ts (the chart whose span is most interior wins,
  // and a disagreement beyond k·√(u₁² + u₂²) is suspect; the service uses k = 2).
  it('when two charts overlap at a chart change, then each time appears once and the more interior chart wins', async () => {
    // Chart A is on until 02:30 on the 9th and traced 20:00–02:00; chart B goes on at 00:00 and is traced 00:00–06:00.
    const lineA = await createLine({ chartOn: '2026-03-02T00:00:00Z', chartOff: '2026-03-09T02:30:00Z' }, '2026-03-08T20:00:00Z', [1001, 1001, 1001, 1001, 1000, 1000, 1000], 0.2);
    const lineB = await createLine({ chartOn: '2026-03-09T00:00:00Z', chartOff: '2026-03-16T00:00:00Z' }, '2026-03-09T00:00:00Z', [1000, 1000, 1000, 999, 999, 999, 999], 0.2);

    const response = await getSeries('2026-03-08', '2026-03-09');

    expect(response.status).toBe(200);
    const times = response.body.points.map((point: { time: string }) => point.time);
    // 20:00 … 06:00 is eleven hours; the three overlap hours are not repeated.
    expect(times).toHaveLength(11);
    expect(new Set(times).size).toBe(11);
    expect(times).toEqual([...times].sort());
    const sourceAt = (iso: string) => response.body.points.find((point: { time: string }) => point.time === iso)?.inkLineId;
    // 00:00: A is 2.5 h inside its span, B 0 h; 01:00: A 1.5 h, B 1 h; 02:00: A 0.5 h, B 2 h.
    expect(sourceAt('2026-03-09T00:00:00.000Z')).toBe(lineA);
    expect(sourceAt('2026-03-09T01:00:00.000Z')).toBe(lineA);
    expect(sourceAt('2026-03-09T02:00:00.000Z')).toBe(lineB);
    expect(sourceAt('2026-03-08T20:00:00.000Z')).toBe(lineA);
    expect(sourceAt('2026-03-09T06:00:00.000Z')).toBe(lineB);
    expect(response.body.sourceCount).toBe(2);
    // Both lines agree within their uncertainty at the overlap, so nothing is suspect.
    expect(response.body.points.every((point: { flag: string }) => point.flag === 'ok')).toBe(true);
  });

  it('when the scans have no chart on / off, then each ink line spans its own first to last point', async () => {
    const lineA = await createLine({}, '2026-03-08T20:00:00Z', [1001, 1001, 1001, 1001, 1000, 1000, 1000], null);
    const lineB = await createLine({}, '2026-03-09T00:00:00Z', [1000, 1000, 1000, 999, 999, 999, 999], null);

    const response = await getSeries('2026-03-08', '2026-03-09');

    const sourceAt = (iso: string) => response.body.points.find((point: { time: string }) => point.time === iso)?.inkLineId;
    // 00:00: A's last point is 2 h away, B's first 0 h; 02:00 is the other way round.
    expect(sourceAt('2026-03-09T00:00:00.000Z')).toBe(lineA);
    expect(sourceAt('2026-03-09T02:00:00.000Z')).toBe(lineB);
    expect(response.body.points).toHaveLength(11);
  });

  it('when the overlap disagrees beyond twice the combined uncertainty, then the chosen point is suspect; within it, it stays ok', async () => {
    // u = 0.1 hPa on both lines: combined √(0.1² + 0.1²) = 0.141 hPa, so the bar is 2 × 0.141 = 0.283 hPa.
    const lineA = await createLine({ chartOn: '2026-03-02T00:00:00Z', chartOff: '2026-03-09T02:30:00Z' }, '2026-03-09T00:00:00Z', [1000.0, 1000.0, 1000.5], 0.1);
    const lineB = await createLine({ chartOn: '2026-03-09T00:00:00Z', chartOff: '2026-03-16T00:00:00Z' }, '2026-03-09T00:00:00Z', [1000.1, 1000.25, 1000.0], 0.1);

    const response = await getSeries('2026-03-09', '2026-03-09');

    expect(response.body.points).toEqual([
      // 0.1 hPa apart: within even one combined uncertainty.
      { time: '2026-03-09T00:00:00.000Z', pressureHpa: 1000.0, flag: 'ok', uncertaintyHpa: 0.1, inkLineId: lineA },
      // 0.25 hPa apart: beyond one combined uncertainty (0.141) but within two, so not suspect.
      { time: '2026-03-09T01:00:00.000Z', pressureHpa: 1000.0, flag: 'ok', uncertaintyHpa: 0.1, inkLineId: lineA },
      // 0.5 hPa apart: beyond 0.283, so B (the more interior chart at 02:00) is kept and flagged.
      { time: '2026-03-09T02:00:00.000Z', pressureHpa: 1000.0, flag: 'suspect', uncertaintyHpa: 0.1, inkLineId: lineB },
    ]);
  });

  it('when the merged series is exported, then the CSV has the uncertainty column and one row per time', async () => {
    const lineA = await createLine({ chartOn: '2026-03-02T00:00:00Z', chartOff: '2026-03-09T02:30:00Z' }, '2026-03-09T00:00:00Z', [1000.0, 1000.0, 1000.5], 0.1);
    const lineB = await createLine({ chartOn: '2026-03-09T00:00:00Z', chartOff: '2026-03-16T00:00:00Z' }, '2026-03-09T00:00:00Z', [1000.1, 1000.25, 1000.0, 999.5], 0.125);

    const response = await request(context.app)
      .get(API.seriesCsv)
      .query({ stationId, from: '2026-03-09', to: '2026-03-09' })
      .set('Authorization', `Bearer ${climatologist.token}`)
      .buffer(true);

    expect(response.status).toBe(200);
    expect(response.text.trimEnd().split('\n')).toEqual([
      'time,pressure_hpa,flag,uncertainty_hpa,ink_line_id',
      `2026-03-09T00:00:00.000Z,1000.00,ok,0.10,${lineA}`,
      `2026-03-09T01:00:00.000Z,1000.00,ok,0.10,${lineA}`,
      // √(0.1² + 0.125²) = 0.160 hPa, bar 0.320 hPa; 0.5 hPa apart is suspect.
      `2026-03-09T02:00:00.000Z,1000.00,suspect,0.13,${lineB}`,
      `2026-03-09T03:00:00.000Z,999.50,ok,0.13,${lineB}`,
    ]);
  });
});

describe('uncertainty of a handed-in trace', () => {
  let context: TestContext;
  let climatologist: TestPerson;
  let volunteer: TestPerson;
  let archivist: TestPerson;
  let stationId: string;
  let scanId: string;

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    climatologist = await createPerson(context.db, ['climatologist']);
    volunteer = await createPerson(context.db, ['volunteer']);
    archivist = await createPerson(context.db, ['archivist']);
    stationId = (await createStation(context.db)).id;
    const form = await createChartForm(context.db);
    scanId = await createScanRow(context.db, { stationId, chartFormId: form.id, uploadedBy: volunteer.id, chartStart: '2026-03-02T00:00:00Z' });
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when a trace is handed in and approved, then each point is stored and served with the pen line centring and registration uncertainty', async () => {
    const draft = syntheticDraft(TEST_WEEKLY_FORM, '2026-03-02T00:00:00Z', 2, 26);
    const handedIn = await request(context.app).post(API.scanInkLines(scanId)).set('Authorization', `Bearer ${volunteer.token}`).send(draft);
    await request(context.app).post(API.inkLineApprove(handedIn.body.inkLineId)).set('Authorization', `Bearer ${archivist.token}`).send({ version: handedIn.body.version }).expect(200);

    const response = await request(context.app)
      .get(API.series)
      .query({ stationId, from: '2026-03-02', to: '2026-03-03' })
      .set('Authorization', `Bearer ${climatologist.token}`);

    expect(handedIn.status).toBe(201);
    // A pen line 0.4 mm wide (common practice) centred anywhere within ±0.2 mm: u = 0.2 mm / √3 (rectangular
    // distribution, GUM JCGM 100:2008 §4.3.7, from memory), at 0.9 mm per hPa on the test form = 0.128 hPa.
    const centringHpa = 0.2 / Math.sqrt(3) / TEST_WEEKLY_FORM.mmPerUnit;
    // The synthetic pins fit to under 0.01 hPa and 0.1 minute, so the registration adds less than 0.001 hPa in quadrature.
    expect(handedIn.body.registrationRmsHpa).toBeLessThan(0.01);
    expect(response.body.points).toHaveLength(25);
    for (const point of response.body.points) {
      expect(point.uncertaintyHpa).toBeGreaterThanOrEqual(centringHpa);
      expect(point.uncertaintyHpa).toBeLessThan(centringHpa + 0.002);
    }
    const stored = await context.db.selectFrom('series_point').select('uncertainty_hpa').where('ink_line_id', '=', handedIn.body.inkLineId).execute();
    expect(stored).toHaveLength(25);
    expect(stored.every((row) => row.uncertainty_hpa !== null && row.uncertainty_hpa >= centringHpa)).toBe(true);
  });
});
