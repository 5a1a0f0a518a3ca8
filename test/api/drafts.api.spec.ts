import request from 'supertest';
import { type BenchWork, EMPTY_BENCH_WORK } from '@shared/api/bench-work';
import type { DraftSaved, MyInkLine, MyInkLineSummary } from '@shared/api/ink-lines';
import type { Page } from '@shared/api/paging';
import { API } from '@shared/api/routes';
import { bridgeStretch, liftStretch } from '@shared/domain/knot-edits';
import { createChartForm, createPerson, createScanRow, createStation, TEST_WEEKLY_FORM, type TestPerson } from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';
import { SYNTHETIC_ERRORS, syntheticDraft, syntheticDraftWithErrors, syntheticPressureHpa } from '../helpers/trace';

const PERIOD_START = '2026-03-02T00:00:00.000Z';
const PERIOD_START_MS = Date.parse(PERIOD_START);

describe('drafts on the server', () => {
  let context: TestContext;
  let volunteer: TestPerson;
  let archivistId: string;
  let stationId: string;
  let chartFormId: string;
  let scanId: string;

  const firstPin = () => syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START).pins.slice(0, 1);

  function save(body: unknown, person = volunteer, id = scanId) {
    return request(context.app).put(API.scanDraft(id)).set('Authorization', `Bearer ${person.token}`).send(body as object);
  }

  function mine(person = volunteer, id = scanId) {
    return request(context.app).get(API.scanMyInkLine(id)).set('Authorization', `Bearer ${person.token}`);
  }

  async function storedWork(inkLineId: string) {
    return (await context.db.selectFrom('ink_line').select(['work', 'version', 'status']).where('id', '=', inkLineId).executeTakeFirstOrThrow());
  }

  beforeAll(async () => {
    context = await createTestContext();
  });

  beforeEach(async () => {
    await truncateTables(context.db);
    volunteer = await createPerson(context.db, ['volunteer']);
    archivistId = (await createPerson(context.db, ['archivist'])).id;
    stationId = (await createStation(context.db)).id;
    chartFormId = (await createChartForm(context.db)).id;
    scanId = await createScanRow(context.db, { stationId, chartFormId, uploadedBy: archivistId, chartStart: PERIOD_START });
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when the first pin is saved, then a draft ink line exists at version 1 with that pin and no pin set', async () => {
    const work: BenchWork = { ...EMPTY_BENCH_WORK, pins: firstPin() };

    const response = await save({ version: null, work });

    expect(response.status).toBe(201);
    const saved = response.body as DraftSaved;
    expect(saved).toMatchObject({ scanId, version: 1 });
    const row = await context.db.selectFrom('ink_line').selectAll().where('id', '=', saved.inkLineId).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ status: 'draft', author_id: volunteer.id, pin_set_id: null, version: 1 });
    expect(row.work).toEqual(work);
  });

  it('when the draft is saved again at its version, then the version grows and the scan reopens exactly as left', async () => {
    const created = (await save({ version: null, work: { ...EMPTY_BENCH_WORK, pins: firstPin() } })).body as DraftSaved;
    const full = syntheticDraftWithErrors(TEST_WEEKLY_FORM, PERIOD_START);
    const work: BenchWork = {
      ...full,
      step: 'marks',
      knots: full.knots.map((k, i) => (i === 3 ? { ...k, confidence: 0.4, gapAfter: true } : i === 7 ? { ...k, bridgeAfter: true } : k)),
      timeMarks: [...full.timeMarks, { xPx: 400, yPx: 300, time: null }],
      chartOn: '2026-03-02T01:50:00.000Z',
    };

    const response = await save({ version: created.version, work });
    const resumed = await mine();

    expect(response.status).toBe(200);
    expect(response.body.version).toBe(2);
    expect(resumed.status).toBe(200);
    const line = resumed.body.inkLine as MyInkLine;
    expect(line).toMatchObject({ inkLineId: created.inkLineId, status: 'draft', version: 2, result: null, handedInAt: null });
    expect(line.work).toEqual(work);
  });

  it('when a second tab saves over a version the first tab already moved on, then it answers 409 draft_version_conflict and keeps the newer work', async () => {
    const created = (await save({ version: null, work: { ...EMPTY_BENCH_WORK, pins: firstPin() } })).body as DraftSaved;
    const newer: BenchWork = { ...EMPTY_BENCH_WORK, pins: syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START).pins.slice(0, 2) };
    await save({ version: created.version, work: newer });

    const stale = await save({ version: created.version, work: { ...EMPTY_BENCH_WORK } });

    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('draft_version_conflict');
    expect(stale.body.error.message).toMatch(/another tab or window/);
    expect(stale.body.error.details).toEqual({ currentVersion: 2 });
    expect(await storedWork(created.inkLineId)).toMatchObject({ version: 2, work: newer });
  });

  it('when a second tab starts a draft the first tab already started, then it answers 409 draft_version_conflict: one draft per volunteer per scan', async () => {
    await save({ version: null, work: { ...EMPTY_BENCH_WORK, pins: firstPin() } });

    const second = await save({ version: null, work: { ...EMPTY_BENCH_WORK } });

    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('draft_version_conflict');
    expect(await context.db.selectFrom('ink_line').select('id').execute()).toHaveLength(1);
  });

  it('when two volunteers pin the same scan, then each has a draft of their own and sees only their own', async () => {
    const other = await createPerson(context.db, ['volunteer']);
    await save({ version: null, work: { ...EMPTY_BENCH_WORK, pins: firstPin() } });

    const response = await save({ version: null, work: { ...EMPTY_BENCH_WORK } }, other);

    expect(response.status).toBe(201);
    expect((await mine(other)).body.inkLine.work.pins).toEqual([]);
    expect((await mine()).body.inkLine.work.pins).toHaveLength(1);
  });

  it('when the work has bad fields, then it answers 400 with the dotted path under work and stores nothing', async () => {
    const pins = firstPin().map((pin) => ({ ...pin, time: 'Tuesday' }));

    const response = await save({ version: null, work: { ...EMPTY_BENCH_WORK, pins, step: 'polish', checkReadings: [{ time: PERIOD_START, pressureHpa: 12 }] } });

    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(response.body.error.details).toEqual({
      'work.pins.0.time': expect.any(String),
      'work.step': expect.any(String),
      'work.checkReadings.0.pressureHpa': expect.any(String),
    });
    expect(await context.db.selectFrom('ink_line').select('id').execute()).toHaveLength(0);
  });

  it('when the volunteer has never opened the scan, then mine answers 200 with no ink line', async () => {
    const response = await mine();

    expect(response.status).toBe(200);
    expect(response.body).toEqual({ inkLine: null });
  });

  it('when "My drafts" is listed, then it pages the caller\'s drafts, last touched first, with station and counts', async () => {
    const secondScanId = await createScanRow(context.db, { stationId, chartFormId, uploadedBy: archivistId, chartStart: '2026-03-09T00:00:00.000Z' });
    const other = await createPerson(context.db, ['volunteer']);
    await save({ version: null, work: { ...EMPTY_BENCH_WORK, pins: firstPin() } });
    await save({ version: null, work: { ...EMPTY_BENCH_WORK, pins: firstPin(), knots: [{ xPx: 1, yPx: 2 }] } }, volunteer, secondScanId);
    await save({ version: null, work: { ...EMPTY_BENCH_WORK } }, other);

    const firstPage = await request(context.app).get(API.myInkLines).query({ pageSize: 1 }).set('Authorization', `Bearer ${volunteer.token}`);
    const secondPage = await request(context.app).get(API.myInkLines).query({ pageSize: 1, page: 1 }).set('Authorization', `Bearer ${volunteer.token}`);

    expect(firstPage.status).toBe(200);
    const page = firstPage.body as Page<MyInkLineSummary>;
    expect(page.total).toBe(2);
    expect(page.items).toHaveLength(1);
    expect(page.items[0]).toMatchObject({ scanId: secondScanId, status: 'draft', pinCount: 1, knotCount: 1, chartStart: '2026-03-09T00:00:00.000Z' });
    expect(page.items[0].stationName).toEqual(expect.any(String));
    expect(Date.parse(page.items[0].updatedAt)).toBeGreaterThanOrEqual(Date.parse((secondPage.body as Page<MyInkLineSummary>).items[0].updatedAt));
    expect((secondPage.body as Page<MyInkLineSummary>).items[0].scanId).toBe(scanId);
  });

  it('when "My drafts" is asked for an unknown status, then it answers 400 validation_failed for status', async () => {
    const response = await request(context.app).get(API.myInkLines).query({ status: 'lost' }).set('Authorization', `Bearer ${volunteer.token}`);

    expect(response.status).toBe(400);
    expect(response.body.error.details).toHaveProperty('status');
  });

  it('when a draft with time marks and check readings is handed in, then the same row is handed in and its series is corrected to the truth', async () => {
    const created = (await save({ version: null, work: { ...EMPTY_BENCH_WORK, pins: firstPin() } })).body as DraftSaved;
    const body = { ...syntheticDraftWithErrors(TEST_WEEKLY_FORM, PERIOD_START), draftVersion: created.version };

    const response = await request(context.app).post(API.scanInkLines(scanId)).set('Authorization', `Bearer ${volunteer.token}`).send(body);

    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({ inkLineId: created.inkLineId, status: 'handed_in', version: 2, pipelineVersion: 1 });
    expect(response.body.clock).toMatchObject({ method: 'piecewise', markCount: 3 });
    expect(response.body.clock.rateMinutesPerDay).toBeCloseTo(SYNTHETIC_ERRORS.clockLossMinutesPerDay, 1);
    expect(response.body.instrument.meanOffsetHpa).toBeCloseTo(-SYNTHETIC_ERRORS.instrumentHighHpa, 1);
    const points = await context.db.selectFrom('series_point').selectAll().where('ink_line_id', '=', created.inkLineId).orderBy('time').execute();
    expect(points.length).toBeGreaterThan(30);
    for (const point of points) {
      const trueHours = (point.time.getTime() - PERIOD_START_MS) / 3_600_000;
      // Invented truth (test/helpers/trace.ts); knots 10 min apart: linear interpolation is within 0.01 hPa of the curve.
      expect(Math.abs((point.pressure_hpa as number) - syntheticPressureHpa(trueHours))).toBeLessThan(0.05);
      // The uncertainty carries the clock and instrument terms beside registration and centring: never below centring alone.
      expect(point.uncertainty_hpa).toBeGreaterThan(0);
    }
    const row = await context.db.selectFrom('ink_line').selectAll().where('id', '=', created.inkLineId).executeTakeFirstOrThrow();
    expect(row.pin_set_id).not.toBeNull();
    expect(row.handed_in_at).not.toBeNull();
    expect(row.work.timeMarks).toHaveLength(3);
    expect(row.knots).toHaveLength(body.knots.length);
    expect(row.result?.corrections.checkReadingUses).toEqual(['used', 'used', 'used']);
    expect(await context.db.selectFrom('ink_line').select('id').execute()).toHaveLength(1);
  });

  it('when a lifted stretch and a bridged skip are handed in, then the stored line keeps both and the series has a gap there and an interpolated value here', async () => {
    // Knots every 10 min from 2 h to 26 h (test/helpers/trace.ts): lift 8 h → 12 h (no ink), bridge 17:40 → 18:20 (a 40-min skip).
    const draft = syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START);
    const knotAt = (hours: number) => Math.round((hours - 2) * 6);
    const liftedKnots = liftStretch(draft.knots, knotAt(8), knotAt(12));
    const skipFrom = knotAt(17 + 40 / 60) - (knotAt(12) - knotAt(8) - 1);
    const knots = bridgeStretch(liftedKnots, skipFrom, skipFrom + 4);
    const created = (await save({ version: null, work: { ...EMPTY_BENCH_WORK, pins: draft.pins, knots } })).body as DraftSaved;

    const response = await request(context.app)
      .post(API.scanInkLines(scanId))
      .set('Authorization', `Bearer ${volunteer.token}`)
      .send({ ...EMPTY_BENCH_WORK, pins: draft.pins, knots, draftVersion: created.version });

    expect(response.status).toBe(201);
    const row = await context.db.selectFrom('ink_line').select(['knots', 'work']).where('id', '=', created.inkLineId).executeTakeFirstOrThrow();
    expect(row.knots.filter((knot) => knot.gapAfter)).toHaveLength(1);
    expect(row.knots.filter((knot) => knot.bridgeAfter)).toHaveLength(1);
    // The knots (with their spans) are stored once, in the knots column (ink-lines.service.ts), exactly as handed in.
    expect(row.knots).toEqual(knots);
    const points = await context.db.selectFrom('series_point').select(['time', 'flag', 'pressure_hpa']).where('ink_line_id', '=', created.inkLineId).orderBy('time').execute();
    const at = (hours: number) => points.find((point) => point.time.getTime() === PERIOD_START_MS + hours * 3_600_000);
    // A gap stores no value (ink-line-reading.ts keeps only valued points): nothing from the lift's start to its end.
    const lifted = points.filter((point) => point.time.getTime() > PERIOD_START_MS + 8 * 3_600_000 && point.time.getTime() < PERIOD_START_MS + 12 * 3_600_000);
    expect(lifted).toEqual([]);
    expect(at(8)?.flag).toBe('ok');
    expect(at(12)?.flag).toBe('ok');
    expect(at(18)?.flag).toBe('interpolated');
    // Invented truth (test/helpers/trace.ts): a straight 40-min join stays within 0.05 hPa of the curve.
    expect(Math.abs((at(18)?.pressure_hpa as number) - syntheticPressureHpa(18))).toBeLessThan(0.05);
    expect(at(17)?.flag).toBe('ok');
    expect(at(13)?.flag).toBe('ok');
  });

  it('when the hand-in carries a stale draft version, then it answers 409 draft_version_conflict and the draft stays a draft', async () => {
    const created = (await save({ version: null, work: { ...EMPTY_BENCH_WORK, pins: firstPin() } })).body as DraftSaved;
    await save({ version: created.version, work: { ...EMPTY_BENCH_WORK } });

    const response = await request(context.app)
      .post(API.scanInkLines(scanId))
      .set('Authorization', `Bearer ${volunteer.token}`)
      .send({ ...syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START), draftVersion: created.version });

    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe('draft_version_conflict');
    expect(await storedWork(created.inkLineId)).toMatchObject({ status: 'draft', version: 2 });
    expect(await context.db.selectFrom('series_point').select('ink_line_id').execute()).toHaveLength(0);
  });

  it('when a handed-in chart is reopened, then mine shows it handed in with its work and result, and neither a new draft nor a second hand-in is taken', async () => {
    const created = (await save({ version: null, work: { ...EMPTY_BENCH_WORK, pins: firstPin() } })).body as DraftSaved;
    const draft = syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START);
    await request(context.app).post(API.scanInkLines(scanId)).set('Authorization', `Bearer ${volunteer.token}`).send({ ...draft, draftVersion: created.version });

    const reopened = await mine();
    const newDraft = await save({ version: null, work: { ...EMPTY_BENCH_WORK } });
    const oldDraft = await save({ version: created.version, work: { ...EMPTY_BENCH_WORK } });
    const again = await request(context.app).post(API.scanInkLines(scanId)).set('Authorization', `Bearer ${volunteer.token}`).send(draft);

    const line = reopened.body.inkLine as MyInkLine;
    expect(line).toMatchObject({ inkLineId: created.inkLineId, status: 'handed_in', version: 2 });
    expect(line.work.pins).toEqual(draft.pins);
    expect(line.result).toMatchObject({ status: 'handed_in', registrationModel: 'affine', seriesPointCount: 25 });
    expect(line.handedInAt).toEqual(expect.any(String));
    for (const refused of [newDraft, oldDraft, again]) {
      expect(refused.status).toBe(409);
      expect(refused.body.error.code).toBe('already_handed_in');
    }
  });

  it('when a returned line is moved back to draft for rework, then mine resumes that same row as the draft', async () => {
    const created = (await save({ version: null, work: { ...EMPTY_BENCH_WORK, pins: firstPin() } })).body as DraftSaved;
    await request(context.app)
      .post(API.scanInkLines(scanId))
      .set('Authorization', `Bearer ${volunteer.token}`)
      .send({ ...syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START), draftVersion: created.version });
    // Review (another feature) returns the line and the volunteer reworks it: the same row goes back to draft.
    await context.db.updateTable('ink_line').set((eb) => ({ status: 'draft', version: eb('version', '+', 1) })).where('id', '=', created.inkLineId).execute();

    const resumed = (await mine()).body.inkLine as MyInkLine;
    const saved = await save({ version: resumed.version, work: { ...resumed.work, step: 'ink' } });

    expect(resumed).toMatchObject({ inkLineId: created.inkLineId, status: 'draft', version: 3 });
    expect(resumed.work.pins).toHaveLength(5);
    expect(saved.status).toBe(200);
    expect(saved.body.version).toBe(4);
  });
});
