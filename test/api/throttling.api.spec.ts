import request from 'supertest';
import { API } from '@shared/api/routes';
import { RESET_REQUESTS_PER_ACCOUNT, SIGN_IN_FAILURES_PER_ACCOUNT, SIGN_IN_FAILURES_PER_ADDRESS } from '../../server/http/rate-limits';
import { createPerson, TEST_PASSWORD, type TestPerson } from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

// Each wrong password costs an argon2id verification, on purpose.
jest.setTimeout(60_000);

describe('sign-in and reset throttling', () => {
  let context: TestContext;
  let person: TestPerson;

  beforeEach(async () => {
    // A fresh app per test: the limits count in memory per app.
    context = await createTestContext();
    await truncateTables(context.db, ['people_change', 'password_reset', 'person_role', 'person']);
    person = await createPerson(context.db, ['volunteer']);
  });

  afterEach(async () => {
    await truncateTables(context.db, ['people_change', 'password_reset', 'person_role', 'person']);
    await context.close();
  });

  it('when one account gets too many wrong passwords, then even the right one is answered 429 with Retry-After', async () => {
    for (let i = 0; i < SIGN_IN_FAILURES_PER_ACCOUNT; i++) {
      const wrong = await request(context.app).post(API.signIn).send({ email: person.email, password: `wrong-${i}` });
      expect(wrong.status).toBe(401);
    }

    const right = await request(context.app).post(API.signIn).send({ email: person.email.toUpperCase(), password: TEST_PASSWORD });

    expect(right.status).toBe(429);
    expect(right.body.error.code).toBe('rate_limited');
    expect(Number(right.headers['retry-after'])).toBeGreaterThan(0);
    expect(right.body.token).toBeUndefined();
  });

  it('when one address tries too many accounts, then it is answered 429, and right sign-ins do not count', async () => {
    for (let i = 0; i < 3; i++) expect((await request(context.app).post(API.signIn).send({ email: person.email, password: TEST_PASSWORD })).status).toBe(200);
    for (let i = 0; i < SIGN_IN_FAILURES_PER_ADDRESS; i++) {
      await request(context.app).post(API.signIn).send({ email: `guess-${i}@isallo.test`, password: 'a-guess' });
    }

    const next = await request(context.app).post(API.signIn).send({ email: person.email, password: TEST_PASSWORD });

    expect(next.status).toBe(429);
    expect(next.headers['retry-after']).toBeDefined();
  });

  it('when one account gets too many reset requests, then it is answered 429 and no more mails are asked for', async () => {
    for (let i = 0; i < RESET_REQUESTS_PER_ACCOUNT; i++) {
      expect((await request(context.app).post(API.passwordResetRequests).send({ email: person.email })).status).toBe(202);
    }

    const next = await request(context.app).post(API.passwordResetRequests).send({ email: person.email });

    expect(next.status).toBe(429);
    expect(next.headers['retry-after']).toBeDefined();
  });
});
