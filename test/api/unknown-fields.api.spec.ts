import request from 'supertest';
import { API, IIIF } from '@shared/api/routes';
import { ROLES } from '@shared/api/roles';
import { makePng } from '../helpers/images';
import { createChartForm, createPerson, createScanRow, createStation, type TestPerson } from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

/**
 * Finding 5 of issue 13: unknown body fields and operator-like or repeated query parameters were ignored, so
 * `?stationId[$ne]=x` applied no filter and answered 200. Every route refuses them with a 400 naming the field.
 */
describe('unknown fields and query parameters on every route', () => {
  let context: TestContext;
  let caller: TestPerson;
  let ids: { station: string; chartForm: string; instrument: string; scan: string; batch: string };
  const missing = '00000000-0000-4000-8000-000000000000';

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    // One caller with every role, so each route reaches its parser rather than a 403.
    caller = await createPerson(context.db, [...ROLES]);
    const station = await createStation(context.db);
    const chartForm = await createChartForm(context.db);
    const instrument = await request(context.app)
      .post(API.stationInstruments(station.id))
      .set('Authorization', `Bearer ${caller.token}`)
      .send({ serial: 'UF-1' });
    const batch = await request(context.app).post(API.intakeBatches).set('Authorization', `Bearer ${caller.token}`).send({ label: 'unknown fields' });
    const scan = await createScanRow(context.db, { stationId: station.id, chartFormId: chartForm.id, uploadedBy: caller.id, chartStart: '1931-03-02T08:00Z' });
    ids = { station: station.id, chartForm: chartForm.id, instrument: instrument.body.id, scan, batch: batch.body.id };
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  type JsonRoute = [string, 'post' | 'patch' | 'put', () => string];
  const jsonRoutes: JsonRoute[] = [
    ['station create', 'post', () => API.stations],
    ['station edit', 'patch', () => API.station(ids.station)],
    ['instrument create', 'post', () => API.stationInstruments(ids.station)],
    ['instrument edit', 'patch', () => API.instrument(ids.instrument)],
    ['chart form create', 'post', () => API.chartForms],
    ['chart form edit', 'patch', () => API.chartForm(ids.chartForm)],
    ['intake batch create', 'post', () => API.intakeBatches],
    ['scan edit', 'patch', () => API.scan(ids.scan)],
    ['scan status', 'post', () => API.scanStatus(ids.scan)],
    ['scan bulk edit', 'post', () => API.scanBulkEdit],
    ['hand-in', 'post', () => API.scanInkLines(ids.scan)],
    ['draft save', 'put', () => API.scanDraft(ids.scan)],
    ['follow ink', 'post', () => API.scanFollowInk(ids.scan)],
    ['approve', 'post', () => API.inkLineApprove(missing)],
    ['return', 'post', () => API.inkLineReturn(missing)],
    ['rework', 'post', () => API.inkLineRework(missing)],
    ['trace priority', 'put', () => API.tracingPriorities],
    ['station tracing', 'put', () => API.stationTracing(ids.station)],
    ['lesson create', 'post', () => API.lessons],
    ['lesson edit', 'patch', () => API.lesson(missing)],
    ['share link create', 'post', () => API.lessonShares(missing)],
    ['api token create', 'post', () => API.apiTokens],
    ['person edit', 'patch', () => API.person(missing)],
    ['invitation create', 'post', () => API.invitations],
    ['own name', 'patch', () => API.me],
    ['own password', 'post', () => API.myPassword],
  ];

  it.each(jsonRoutes)('when the %s body holds an unknown field, then it answers 400 naming it', async (_name, method, url) => {
    const response = await request(context.app)[method](url()).set('Authorization', `Bearer ${caller.token}`).send({ unknownField: 1 });

    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(response.body.error.details).toHaveProperty('unknownField');
  });

  it('when a nested bulk-edit item or its set holds an unknown field, then the 400 names it by its path', async () => {
    const response = await request(context.app)
      .post(API.scanBulkEdit)
      .set('Authorization', `Bearer ${caller.token}`)
      .send({ scans: [{ id: ids.scan, version: 1, colour: 'red' }], set: { box: '3', shelf: '2' } });

    expect(response.status).toBe(400);
    expect(response.body.error.details).toMatchObject({ 'scans[0].colour': expect.any(String), 'set.shelf': expect.any(String) });
  });

  it.each([
    ['scan upload', () => API.scans],
    ['intake file', () => API.intakeBatchFiles(ids.batch)],
  ])('when the %s form holds an unknown field, then it answers 400 naming it and stores nothing', async (_name, url) => {
    const before = await context.db.selectFrom('scan').select((eb) => eb.fn.countAll<string>().as('n')).executeTakeFirstOrThrow();

    const response = await request(context.app)
      .post(url())
      .set('Authorization', `Bearer ${caller.token}`)
      .field('stationId', ids.station)
      .field('chartFormId', ids.chartForm)
      .field('chartStart', '1931-03-09T08:00Z')
      .field('unknownField', '1')
      .attach('file', await makePng(40, 20), 'unknown-field.png');

    expect(response.status).toBe(400);
    expect(response.body.error.details).toHaveProperty('unknownField');
    const after = await context.db.selectFrom('scan').select((eb) => eb.fn.countAll<string>().as('n')).executeTakeFirstOrThrow();
    expect(after.n).toBe(before.n);
  });

  const queryRoutes: [string, () => string][] = [
    ['stations', () => API.stations],
    ['station instruments', () => API.stationInstruments(ids.station)],
    ['chart forms', () => API.chartForms],
    ['intake batches', () => API.intakeBatches],
    ['scans', () => API.scans],
    ['scan status counts', () => API.scanStatusCounts],
    ['scan change log', () => API.scanChangeLog(ids.scan)],
    ['my ink lines', () => API.myInkLines],
    ['review', () => API.review],
    ['desk lines', () => API.deskLines],
    ['tracing progress', () => API.tracingProgress],
    ['trace priorities', () => API.tracingPriorities],
    ['series', () => `${API.series}?stationId=${ids.station}`],
    ['series query', () => `${API.seriesQuery}?stationId=${ids.station}`],
    ['lessons', () => API.lessons],
    ['api tokens', () => API.apiTokens],
    ['people', () => API.people],
    ['people changes', () => API.peopleChanges],
    ['invitations', () => API.invitations],
  ];

  it.each(queryRoutes)('when the %s list gets an operator-like parameter, then it answers 400 naming it', async (_name, url) => {
    const separator = url().includes('?') ? '&' : '?';

    const response = await request(context.app).get(`${url()}${separator}x[$ne]=1`).set('Authorization', `Bearer ${caller.token}`);

    expect(response.status).toBe(400);
    expect(response.body.error.details).toHaveProperty(['x[$ne]']);
  });

  it.each([...queryRoutes, ['point chart', () => `${API.seriesPointChart}?stationId=${ids.station}&time=2026-03-01T00:00:00Z`] as [string, () => string]])(
    'when the %s request gets a parameter it does not take, then it answers 400 naming it instead of ignoring it',
    async (_name, url) => {
      const separator = url().includes('?') ? '&' : '?';

      const response = await request(context.app).get(`${url()}${separator}colour=red`).set('Authorization', `Bearer ${caller.token}`);

      expect(response.status).toBe(400);
      expect(response.body.error.details).toHaveProperty('colour');
    },
  );

  const noQueryRoutes: [string, () => string][] = [
    ['scan', () => API.scan(ids.scan)],
    ['station', () => API.station(ids.station)],
    ['desk summary', () => API.deskSummary],
    ['station coverage', () => API.stationCoverage(ids.station)],
    ['IIIF info.json', () => IIIF.info(ids.scan)],
  ];

  it.each(noQueryRoutes)('when the %s request, which takes no query, gets a parameter, then it answers 400 naming it', async (_name, url) => {
    const response = await request(context.app).get(`${url()}?colour=red`).set('Authorization', `Bearer ${caller.token}`);

    expect(response.status).toBe(400);
    expect(response.body.error.details).toEqual({ colour: 'colour is not a parameter of this request; it takes none' });
  });

  it.each(queryRoutes)('when the %s list gets a parameter twice, then it answers 400 naming it', async (_name, url) => {
    const separator = url().includes('?') ? '&' : '?';

    const response = await request(context.app).get(`${url()}${separator}page=1&page=2`).set('Authorization', `Bearer ${caller.token}`);

    expect(response.status).toBe(400);
    expect(response.body.error.details).toHaveProperty('page');
  });
});
