import request from 'supertest';
import { API } from '@shared/api/routes';
import type { PersonSummary } from '@shared/api/people';
import { createPerson, type TestPerson } from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

describe('people list', () => {
  let context: TestContext;
  let admin: TestPerson;

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    admin = await createPerson(context.db, ['admin'], 'a-admin@isallo.test');
    await createPerson(context.db, ['archivist', 'volunteer'], 'b-both@isallo.test');
    await createPerson(context.db, ['teacher'], 'c-teacher@isallo.test');
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when an admin lists people a page at a time, then each page has its slice, the total and every role', async () => {
    const first = await request(context.app).get(API.people).query({ pageSize: 2, sort: 'email' }).set('Authorization', `Bearer ${admin.token}`);
    const second = await request(context.app).get(API.people).query({ page: 1, pageSize: 2, sort: 'email' }).set('Authorization', `Bearer ${admin.token}`);

    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ total: 3, page: 0, pageSize: 2 });
    expect(first.body.items.map((person: PersonSummary) => [person.email, person.roles])).toEqual([
      ['a-admin@isallo.test', ['admin']],
      ['b-both@isallo.test', ['archivist', 'volunteer']],
    ]);
    expect(second.body.items.map((person: PersonSummary) => person.email)).toEqual(['c-teacher@isallo.test']);
    expect(Number.isNaN(Date.parse(second.body.items[0].createdAt))).toBe(false);
    expect(JSON.stringify(first.body)).not.toContain('password');
  });

  it('when the list is sorted by e-mail descending, then the order is reversed', async () => {
    const response = await request(context.app).get(API.people).query({ sort: 'email', direction: 'desc' }).set('Authorization', `Bearer ${admin.token}`);

    expect(response.body.items.map((person: PersonSummary) => person.email)).toEqual([
      'c-teacher@isallo.test',
      'b-both@isallo.test',
      'a-admin@isallo.test',
    ]);
  });

  it('when paging parameters are out of range, then it answers 400 naming each', async () => {
    const response = await request(context.app)
      .get(API.people)
      .query({ page: -1, pageSize: 500, sort: 'password' })
      .set('Authorization', `Bearer ${admin.token}`);

    expect(response.status).toBe(400);
    expect(Object.keys(response.body.error.details).sort()).toEqual(['page', 'pageSize', 'sort']);
  });
});
