import request from 'supertest';
import { API } from '@shared/api/routes';
import { createTestContext, type TestContext } from '../helpers/test-app';

describe('health, unknown routes and headers', () => {
  let context: TestContext;

  beforeAll(async () => {
    context = await createTestContext();
  });

  afterAll(async () => {
    await context.close();
  });

  it('when the health route is called without a token, then it answers ok', async () => {
    const response = await request(context.app).get(API.health);

    expect(response.status).toBe(200);
    expect(response.body).toEqual({ ok: true });
  });

  it('when an unknown /api path is called, then it answers 404 not_found as JSON', async () => {
    const response = await request(context.app).get('/api/no-such-thing');

    expect(response.status).toBe(404);
    expect(response.headers['content-type']).toMatch(/application\/json/);
    expect(response.body.error.code).toBe('not_found');
  });

  it('when any response is sent, then its Content-Security-Policy allows only the own origin', async () => {
    const response = await request(context.app).get(API.health);

    const policy = response.headers['content-security-policy'] as string;
    expect(policy).toContain("default-src 'self'");
    expect(policy).toContain("script-src 'self'");
    expect(policy).toContain("style-src 'self' 'unsafe-inline'");
    expect(policy).toContain("img-src 'self' data: blob:");
    expect(policy).toContain("worker-src 'self' blob:");
    expect(policy).not.toMatch(/https?:/);
  });

  it('when a JSON body is malformed, then it answers 400 bad_request without a stack trace', async () => {
    const response = await request(context.app).post(API.signIn).set('Content-Type', 'application/json').send('{"email":');

    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('bad_request');
    expect(JSON.stringify(response.body)).not.toMatch(/at .*\.(js|ts):\d+/);
  });
});
