import { createHash } from 'node:crypto';
import request from 'supertest';
import { API_TOKEN_PREFIX } from '@shared/api/api-tokens';
import { API } from '@shared/api/routes';
import { createPerson, createStation, type TestPerson } from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

describe('API tokens', () => {
  let context: TestContext;
  let climatologist: TestPerson;
  let otherClimatologist: TestPerson;
  let stationId: string;

  function createToken(person: TestPerson, name: string) {
    return request(context.app).post(API.apiTokens).set('Authorization', `Bearer ${person.token}`).send({ name });
  }

  beforeAll(async () => {
    context = await createTestContext();
  });

  beforeEach(async () => {
    await truncateTables(context.db, ['api_token', 'person_role', 'person', 'station']);
    climatologist = await createPerson(context.db, ['climatologist']);
    otherClimatologist = await createPerson(context.db, ['climatologist']);
    stationId = (await createStation(context.db)).id;
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when a token is created, then it is shown once and only its SHA-256 is stored', async () => {
    const created = await createToken(climatologist, 'laptop: R scripts');
    const listed = await request(context.app).get(API.apiTokens).set('Authorization', `Bearer ${climatologist.token}`);

    expect(created.status).toBe(201);
    expect(created.body.token.startsWith(API_TOKEN_PREFIX)).toBe(true);
    expect(created.body).toMatchObject({ name: 'laptop: R scripts', lastUsedAt: null, revokedAt: null });
    const stored = await context.db.selectFrom('api_token').selectAll().executeTakeFirstOrThrow();
    expect(stored.token_sha256).toBe(createHash('sha256').update(created.body.token).digest('hex'));
    expect(JSON.stringify(stored)).not.toContain(created.body.token);
    expect(listed.body).toMatchObject({ total: 1, items: [{ id: created.body.id, name: 'laptop: R scripts', lastUsedAt: null }] });
    expect(listed.body.items[0]).not.toHaveProperty('token');
  });

  it('when a token reads the series, coverage and stations, then it works and the list shows when it was last used', async () => {
    const { body } = await createToken(climatologist, 'cron');
    const auth = `Bearer ${body.token}`;

    const series = await request(context.app).get(API.seriesQuery).query({ stationId, from: '2026-01-01', to: '2026-01-31', step: 'daily' }).set('Authorization', auth);
    const coverage = await request(context.app).get(API.stationCoverage(stationId)).set('Authorization', auth);
    const stations = await request(context.app).get(API.stations).set('Authorization', auth);

    expect([series.status, coverage.status, stations.status]).toEqual([200, 200, 200]);
    const listed = await request(context.app).get(API.apiTokens).set('Authorization', `Bearer ${climatologist.token}`);
    expect(Date.parse(listed.body.items[0].lastUsedAt)).not.toBeNaN();
  });

  it('when a token is sent to another route or to a write, then it is refused with api_token_not_allowed', async () => {
    const { body } = await createToken(climatologist, 'cron');
    const auth = `Bearer ${body.token}`;

    const scans = await request(context.app).get(API.scans).set('Authorization', auth);
    const tokens = await request(context.app).get(API.apiTokens).set('Authorization', auth);
    const write = await request(context.app).patch(API.station(stationId)).set('Authorization', auth).send({ version: 1, name: 'Renamed' });

    expect([scans.status, tokens.status, write.status]).toEqual([403, 403, 403]);
    expect([scans.body.error.code, tokens.body.error.code, write.body.error.code]).toEqual(['api_token_not_allowed', 'api_token_not_allowed', 'api_token_not_allowed']);
    const station = await context.db.selectFrom('station').select('name').where('id', '=', stationId).executeTakeFirstOrThrow();
    expect(station.name).not.toBe('Renamed');
  });

  it('when a token is revoked, then it no longer opens anything; another person cannot revoke it', async () => {
    const { body } = await createToken(climatologist, 'old laptop');

    const byOther = await request(context.app).delete(API.apiToken(body.id)).set('Authorization', `Bearer ${otherClimatologist.token}`);
    const revoked = await request(context.app).delete(API.apiToken(body.id)).set('Authorization', `Bearer ${climatologist.token}`);
    const used = await request(context.app).get(API.stations).set('Authorization', `Bearer ${body.token}`);

    expect(byOther.status).toBe(404);
    expect(byOther.body.error.code).toBe('api_token_not_found');
    expect(revoked.status).toBe(200);
    expect(Date.parse(revoked.body.revokedAt)).not.toBeNaN();
    expect(used.status).toBe(401);
  });

  it('when a forged token is sent, then it answers 401', async () => {
    const response = await request(context.app).get(API.stations).set('Authorization', `Bearer ${API_TOKEN_PREFIX}not-a-real-token`);

    expect(response.status).toBe(401);
  });

  it('when a token has no name, then it answers 400 naming the field', async () => {
    const response = await createToken(climatologist, '  ');

    expect(response.status).toBe(400);
    expect(response.body.error.details).toEqual({ name: 'a token needs a name' });
  });
});
