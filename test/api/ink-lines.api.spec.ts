import request from 'supertest';
import { API } from '@shared/api/routes';
import type { InkLineSaved } from '@shared/api/ink-lines';
import { createChartForm, createPerson, createScanRow, createStation, TEST_WEEKLY_FORM, type TestPerson } from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';
import { collinearDraft, syntheticDraft, syntheticPressureHpa } from '../helpers/trace';

const PERIOD_START = '2026-03-02T00:00:00.000Z';
const PERIOD_START_MS = Date.parse(PERIOD_START);

describe('handing in an ink line', () => {
  let context: TestContext;
  let volunteer: TestPerson;
  let stationId: string;
  let scanId: string;

  function handIn(body: unknown, id = scanId) {
    return request(context.app).post(API.scanInkLines(id)).set('Authorization', `Bearer ${volunteer.token}`).send(body as object);
  }

  async function countRows(table: 'pin_set' | 'ink_line' | 'series_point'): Promise<number> {
    const { count } = await context.db.selectFrom(table).select((eb) => eb.fn.countAll<number>().as('count')).executeTakeFirstOrThrow();
    return count;
  }

  beforeAll(async () => {
    context = await createTestContext();
  });

  beforeEach(async () => {
    await truncateTables(context.db);
    volunteer = await createPerson(context.db, ['volunteer']);
    const archivist = await createPerson(context.db, ['archivist']);
    stationId = (await createStation(context.db)).id;
    const form = await createChartForm(context.db);
    scanId = await createScanRow(context.db, { stationId, chartFormId: form.id, uploadedBy: archivist.id, chartStart: PERIOD_START });
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when a good trace is handed in, then its hourly points are stored for the station and the scan is traced', async () => {
    const draft = syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START, 2, 26);

    const response = await handIn(draft);

    expect(response.status).toBe(201);
    const saved = response.body as InkLineSaved;
    expect(saved).toMatchObject({ scanId, status: 'handed_in', version: 1, registrationModel: 'affine', pipelineVersion: 1, clock: null, instrument: null });
    expect(saved.registrationRmsHpa).toBeLessThan(0.01);
    expect(saved.registrationRmsMinutes).toBeLessThan(0.1);
    expect(saved.pinResiduals).toHaveLength(5);
    // Knots run from hour 2 to hour 26, so the hourly points are 02:00 … 02:00 next day.
    expect(saved.seriesPointCount).toBe(25);
    expect(saved.firstPoint?.time).toBe('2026-03-02T02:00:00.000Z');

    const points = await context.db
      .selectFrom('series_point')
      .selectAll()
      .where('ink_line_id', '=', saved.inkLineId)
      .orderBy('time')
      .execute();
    expect(points).toHaveLength(25);
    for (const point of points) {
      expect(point.station_id).toBe(stationId);
      expect(point.flag).toBe('ok');
      const hours = (point.time.getTime() - PERIOD_START_MS) / 3_600_000;
      expect(Number.isInteger(hours)).toBe(true);
      // Knots every 10 minutes on a smooth curve: linear interpolation is within 0.01 hPa of it.
      expect(Math.abs((point.pressure_hpa as number) - syntheticPressureHpa(hours))).toBeLessThan(0.01);
    }
    const inkLine = await context.db.selectFrom('ink_line').selectAll().where('id', '=', saved.inkLineId).executeTakeFirstOrThrow();
    expect(inkLine).toMatchObject({ scan_id: scanId, author_id: volunteer.id, status: 'handed_in', version: 1 });
    expect(inkLine.knots).toHaveLength(draft.knots.length);
    const pinSet = await context.db.selectFrom('pin_set').selectAll().where('id', '=', inkLine.pin_set_id).executeTakeFirstOrThrow();
    expect(pinSet.pins).toEqual(draft.pins);
    expect(pinSet.model).toBe('affine');
    expect(pinSet.rms_hpa).toBeCloseTo(saved.registrationRmsHpa, 9);
    const scan = await context.db.selectFrom('scan').select('status').where('id', '=', scanId).executeTakeFirstOrThrow();
    expect(scan.status).toBe('traced');
  });

  it('when the knots leave a span longer than three hours, then the hours inside it have no points', async () => {
    const early = syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START, 2, 10);
    const late = syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START, 20, 24);

    const response = await handIn({ pins: early.pins, knots: [...early.knots, ...late.knots] });

    expect(response.status).toBe(201);
    const times = (await context.db.selectFrom('series_point').select('time').orderBy('time').execute()).map(
      (row) => (row.time.getTime() - PERIOD_START_MS) / 3_600_000,
    );
    expect(times).toEqual([2, 3, 4, 5, 6, 7, 8, 9, 10, 20, 21, 22, 23, 24]);
  });

  it('when a trace of 100 000 knots is handed in, then the body is accepted', async () => {
    const { pins, knots } = syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START, 2, 26);
    const manyKnots = Array.from({ length: 100_000 }, (_, i) => knots[Math.floor((i * knots.length) / 100_000)]);

    const response = await handIn({ pins, knots: manyKnots });

    expect(response.status).toBe(201);
    expect(response.body.seriesPointCount).toBeGreaterThan(0);
    // Two 3.5 MB bodies through JSON and PostgreSQL: slower than the others on a shared machine.
  }, 20_000);

  it('when fewer than three pins are sent, then it answers 400 validation_failed for pins and stores nothing', async () => {
    const { pins, knots } = syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START);

    const response = await handIn({ pins: pins.slice(0, 2), knots });

    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(response.body.error.details).toHaveProperty('pins');
    expect(await countRows('ink_line')).toBe(0);
  });

  it('when the pins lie on one line, then it answers 422 registration_failed with reason collinear_pins and stores nothing', async () => {
    const response = await handIn(collinearDraft(TEST_WEEKLY_FORM, PERIOD_START));

    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('registration_failed');
    expect(response.body.error.details).toEqual({ reason: 'collinear_pins' });
    expect(await countRows('pin_set')).toBe(0);
    expect(await countRows('ink_line')).toBe(0);
    expect(await countRows('series_point')).toBe(0);
    const scan = await context.db.selectFrom('scan').select('status').where('id', '=', scanId).executeTakeFirstOrThrow();
    expect(scan.status).toBe('ready_to_trace');
  });

  it('when pins and knots have bad fields, then it answers 400 with the dotted path of each', async () => {
    const { pins, knots } = syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START);
    const badPins = pins.map((pin, i) => (i === 1 ? { ...pin, xPx: 'left' } : i === 3 ? { ...pin, time: 'Tuesday' } : pin));
    const badKnots = knots.map((knot, i) => (i === 0 ? { xPx: knot.xPx } : knot));

    const response = await handIn({ pins: badPins, knots: badKnots });

    expect(response.status).toBe(400);
    expect(response.body.error.details).toEqual({
      'pins.1.xPx': expect.any(String),
      'pins.3.time': expect.any(String),
      'knots.0': expect.any(String),
    });
  });

  it('when the body is not an object, then it answers 400 validation_failed', async () => {
    const response = await request(context.app)
      .post(API.scanInkLines(scanId))
      .set('Authorization', `Bearer ${volunteer.token}`)
      .set('Content-Type', 'application/json')
      .send('[1, 2, 3]');

    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
  });

  it('when the scan does not exist, then it answers 404 scan_not_found', async () => {
    const response = await handIn(syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START), '00000000-0000-4000-8000-000000000000');

    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('scan_not_found');
  });

  it('when the scan has no station, then the hand-in answers 409 scan_incomplete naming stationId and stores nothing', async () => {
    await context.db.updateTable('scan').set({ station_id: null }).where('id', '=', scanId).execute();

    const response = await handIn(syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START));

    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe('scan_incomplete');
    expect(response.body.error.details).toEqual({ missing: ['stationId'] });
    expect(await countRows('ink_line')).toBe(0);
  });

  it('when the scan was withdrawn, then it answers 409 scan_not_traceable and stores nothing', async () => {
    await context.db.updateTable('scan').set({ status: 'withdrawn' }).where('id', '=', scanId).execute();

    const response = await handIn(syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START));

    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe('scan_not_traceable');
    expect(await countRows('ink_line')).toBe(0);
  });

  it("when the volunteer's account was removed after sign-in, then it answers 401 and stores nothing", async () => {
    await context.db.deleteFrom('person').where('id', '=', volunteer.id).execute();

    const response = await handIn(syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START));

    // The session is checked against the database before the route runs: the removed person's token has ended.
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('session_ended');
    expect(await countRows('pin_set')).toBe(0);
    const scan = await context.db.selectFrom('scan').select('status').where('id', '=', scanId).executeTakeFirstOrThrow();
    expect(scan.status).toBe('ready_to_trace');
  });

  it('when a second volunteer hands in a chart whose station needs one line, then it answers 409 chart_fully_traced and keeps the first', async () => {
    const draft = syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START, 2, 6);
    const other = await createPerson(context.db, ['volunteer']);
    const first = await handIn(draft);

    const second = await request(context.app).post(API.scanInkLines(scanId)).set('Authorization', `Bearer ${other.token}`).send(draft);

    expect(first.status).toBe(201);
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('chart_fully_traced');
    expect(await countRows('ink_line')).toBe(1);
    expect(await countRows('series_point')).toBe(5);
  });

  it('when the same volunteer hands in a second time, then it answers 409 already_handed_in and stores nothing more', async () => {
    const draft = syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START, 2, 6);
    await handIn(draft);

    const second = await handIn(draft);

    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('already_handed_in');
    expect(await countRows('ink_line')).toBe(1);
    expect(await countRows('series_point')).toBe(5);
  });
});
