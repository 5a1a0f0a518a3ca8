import jwt from 'jsonwebtoken';
import request from 'supertest';
import { API } from '@shared/api/routes';
import { issueToken } from '../../server/auth/tokens';
import { createPerson, TEST_PASSWORD, type TestPerson } from '../helpers/factories';
import { createTestContext, TEST_JWT_SECRET, type TestContext, truncateTables } from '../helpers/test-app';

describe('sign-in and tokens', () => {
  let context: TestContext;
  let person: TestPerson;

  beforeAll(async () => {
    context = await createTestContext({ tokenTtlSeconds: 7200 });
  });

  beforeEach(async () => {
    await truncateTables(context.db, ['person_role', 'person']);
    person = await createPerson(context.db, ['archivist', 'volunteer'], 'Idris.Test@isallo.test');
  });

  afterAll(async () => {
    await truncateTables(context.db, ['person_role', 'person']);
    await context.close();
  });

  it('when the e-mail and password are right, then it issues an HS256 token for the person with their roles', async () => {
    const startedMs = Date.now();

    const response = await request(context.app).post(API.signIn).send({ email: 'idris.test@isallo.test', password: TEST_PASSWORD });

    expect(response.status).toBe(200);
    expect(response.body.person).toEqual({ id: person.id, email: person.email, displayName: expect.any(String), roles: ['archivist', 'volunteer'] });
    const claims = jwt.verify(response.body.token, TEST_JWT_SECRET, { algorithms: ['HS256'] }) as jwt.JwtPayload;
    expect(claims.sub).toBe(person.id);
    expect(claims['roles']).toEqual(['archivist', 'volunteer']);
    const expiresAtMs = Date.parse(response.body.expiresAt);
    expect(expiresAtMs).toBe((claims.exp as number) * 1000);
    // Two hours from the moment of issue, which lies between the request and the response (exp is whole seconds).
    const answeredMs = Date.now();
    expect(expiresAtMs).toBeGreaterThanOrEqual(Math.floor(startedMs / 1000) * 1000 + 7200_000);
    expect(expiresAtMs).toBeLessThanOrEqual(answeredMs + 7200_000);
  });

  it('when the password is wrong, then it answers 401 unauthenticated with a plain message', async () => {
    const response = await request(context.app).post(API.signIn).send({ email: person.email, password: 'not-the-password' });

    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('unauthenticated');
    expect(response.body.error.message).toBe('The e-mail address or password is not right.');
    expect(response.body.token).toBeUndefined();
  });

  it('when the e-mail is unknown, then it answers the same 401 as a wrong password', async () => {
    const response = await request(context.app).post(API.signIn).send({ email: 'nobody@isallo.test', password: TEST_PASSWORD });

    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('unauthenticated');
    expect(response.body.error.message).toBe('The e-mail address or password is not right.');
  });

  it('when the body lacks e-mail and password, then it answers 400 validation_failed naming both', async () => {
    const response = await request(context.app).post(API.signIn).send({});

    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(Object.keys(response.body.error.details).sort()).toEqual(['email', 'password']);
  });

  it('when a valid token calls me, then it answers the person from the database', async () => {
    const response = await request(context.app).get(API.me).set('Authorization', `Bearer ${person.token}`);

    expect(response.status).toBe(200);
    expect(response.body).toEqual({ id: person.id, email: person.email, displayName: expect.any(String), roles: ['archivist', 'volunteer'] });
  });

  it('when the token has expired, then it answers 401 token_expired', async () => {
    const { token } = issueToken(TEST_JWT_SECRET, person.id, person.roles, 60, Date.now() - 2 * 3600_000);

    const response = await request(context.app).get(API.me).set('Authorization', `Bearer ${token}`);

    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('token_expired');
  });

  it('when the token is signed with another secret, then it answers 401 unauthenticated', async () => {
    const { token } = issueToken('another-secret-of-enough-length', person.id, person.roles, 600);

    const response = await request(context.app).get(API.me).set('Authorization', `Bearer ${token}`);

    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('unauthenticated');
  });

  it('when the token claims the none algorithm, then it answers 401 unauthenticated', async () => {
    const unsigned = jwt.sign({ roles: ['admin'] }, '', { algorithm: 'none', subject: person.id, expiresIn: 600 });

    const response = await request(context.app).get(API.me).set('Authorization', `Bearer ${unsigned}`);

    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('unauthenticated');
  });

  it('when the token is valid but its person was removed, then me answers 401 unauthenticated', async () => {
    await context.db.deleteFrom('person').where('id', '=', person.id).execute();

    const response = await request(context.app).get(API.me).set('Authorization', `Bearer ${person.token}`);

    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('unauthenticated');
  });
});
