import request from 'supertest';
import { API } from '@shared/api/routes';
import { buildAllPendingSeries } from '../../server/series/series-build';
import { createChartForm, createInkLineWithPoints, createPerson, createScanRow, createStation, type TestPerson } from '../helpers/factories';
import { checkAgainstSchema } from '../helpers/json-schema-check';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

type Json = Record<string, any>;

describe('OpenAPI description', () => {
  let context: TestContext;
  let climatologist: TestPerson;
  let stationId: string;
  let document: Json;

  /** The schema of a route's answer in the description. */
  function responseSchema(path: string, method: string, status: number): Json {
    return document.paths[path][method].responses[String(status)].content['application/json'].schema;
  }

  function problems(body: unknown, path: string, method: string, status: number): string[] {
    return checkAgainstSchema(body, responseSchema(path, method, status), document.components.schemas);
  }

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    climatologist = await createPerson(context.db, ['climatologist']);
    const volunteer = await createPerson(context.db, ['volunteer']);
    stationId = (await createStation(context.db)).id;
    const form = await createChartForm(context.db);
    const scanId = await createScanRow(context.db, { stationId, chartFormId: form.id, uploadedBy: volunteer.id, chartStart: '2026-03-01T00:00Z' });
    const points = Array.from({ length: 30 }, (_, i) => ({ time: new Date(Date.UTC(2026, 2, 1) + i * 3_600_000).toISOString(), pressureHpa: 1000 + i / 10 }));
    await createInkLineWithPoints(context.db, { scanId, stationId, authorId: volunteer.id, points });
    await buildAllPendingSeries(context.db);
    document = (await request(context.app).get(API.openApi)).body;
    // Seconds on a loaded machine.
  }, 30_000);

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when the description is fetched, then it is OpenAPI 3.1 with the series, coverage and token routes', async () => {
    expect(document.openapi).toBe('3.1.0');
    expect(Object.keys(document.paths).sort()).toEqual(['/api/series/point-chart', '/api/series/query', '/api/stations/{stationId}/coverage', '/api/tokens', '/api/tokens/{tokenId}']);
    const parameters = document.paths['/api/series/query'].get.parameters.map((parameter: { name: string }) => parameter.name);
    expect(parameters).toEqual(expect.arrayContaining(['stationId', 'from', 'to', 'step', 'aggregate', 'flags', 'excludeFlags', 'format']));
  });

  it('when real series answers at the raw and daily steps are checked against it, then they fit', async () => {
    const auth = `Bearer ${climatologist.token}`;
    const raw = await request(context.app).get(API.seriesQuery).query({ stationId, from: '2026-03-01', to: '2026-03-02', provenance: 'true' }).set('Authorization', auth);
    const daily = await request(context.app).get(API.seriesQuery).query({ stationId, from: '2026-03-01', to: '2026-03-02', step: 'daily' }).set('Authorization', auth);

    expect(raw.body.stations[0].points).toHaveLength(30);
    expect(problems(raw.body, '/api/series/query', 'get', 200)).toEqual([]);
    expect(problems(daily.body, '/api/series/query', 'get', 200)).toEqual([]);
  });

  it('when real coverage, token and error answers are checked against it, then they fit, and a wrong body does not', async () => {
    const auth = `Bearer ${climatologist.token}`;
    const coverage = await request(context.app).get(API.stationCoverage(stationId)).set('Authorization', auth);
    const created = await request(context.app).post(API.apiTokens).set('Authorization', auth).send({ name: 'openapi test' });
    const listed = await request(context.app).get(API.apiTokens).set('Authorization', auth);
    const tooLong = await request(context.app).get(API.seriesQuery).query({ stationId, from: '1900-01-01', to: '1999-12-31', step: 'hourly' }).set('Authorization', auth);

    expect(problems(coverage.body, '/api/stations/{stationId}/coverage', 'get', 200)).toEqual([]);
    expect(problems(created.body, '/api/tokens', 'post', 201)).toEqual([]);
    expect(problems(listed.body, '/api/tokens', 'get', 200)).toEqual([]);
    expect(problems(tooLong.body, '/api/series/query', 'get', 400)).toEqual([]);
    // The check can fail: a coverage body without its months does not fit.
    expect(problems({ ...coverage.body, months: undefined, version: 'one' }, '/api/stations/{stationId}/coverage', 'get', 200).length).toBeGreaterThan(0);
  });

  it('when the reference page is opened, then it lists each route in HTML', async () => {
    const response = await request(context.app).get(API.apiReference);

    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toContain('text/html');
    expect(response.text).toContain('GET /api/series/query');
    expect(response.text).toContain('POST /api/tokens');
  });
});
