import path from 'node:path';
import request from 'supertest';
import { API } from '@shared/api/routes';
import { seedDemo } from '../../server/demo/seed-demo';
import { DEMO_LESSON_TITLE } from '../../server/demo/demo-lesson';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../server/demo/demo-scenario';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

const FIXTURES_DIR = path.resolve(__dirname, '../../fixtures');
const MISSING_FIXTURES_DIR = path.resolve(__dirname, 'no-fixtures-here');

describe('demo scenario seed', () => {
  let context: TestContext;

  beforeAll(async () => {
    context = await createTestContext();
  });

  beforeEach(async () => {
    await truncateTables(context.db);
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when the demo is seeded, then every demo account signs in with the demo password and holds its role', async () => {
    await seedDemo(context, { fixturesDir: MISSING_FIXTURES_DIR });

    const responses = await Promise.all(
      DEMO_PEOPLE.map((person) => request(context.app).post(API.signIn).send({ email: person.email, password: DEMO_PASSWORD })),
    );

    expect(responses.map((response) => response.status)).toEqual(DEMO_PEOPLE.map(() => 200));
    expect(responses.map((response) => response.body.person.roles)).toEqual(DEMO_PEOPLE.map((person) => person.roles));
    const stations = await context.db.selectFrom('station').select(['code', 'name']).orderBy('code').execute();
    expect(stations).toEqual([
      { code: 'KRO', name: 'Kestrel Ridge Observatory' },
      { code: 'SBS', name: 'Saltmere Bay School' },
    ]);
    const forms = await context.db.selectFrom('chart_form').select(['drum_hours']).orderBy('drum_hours').execute();
    expect(forms.map((form) => form.drum_hours)).toEqual([26, 168]);
  });

  it('when the demo is seeded twice, then the second run does nothing', async () => {
    const first = await seedDemo(context, { fixturesDir: MISSING_FIXTURES_DIR });

    const second = await seedDemo(context, { fixturesDir: MISSING_FIXTURES_DIR });

    expect(first.isSeeded).toBe(true);
    expect(second.isSeeded).toBe(false);
    expect(await context.db.selectFrom('person').select('id').execute()).toHaveLength(DEMO_PEOPLE.length);
    expect(await context.db.selectFrom('station').select('id').execute()).toHaveLength(2);
  });

  it('when the generated weekly sample exists, then Kestrel Ridge has a ready scan, an approved one with a series and one waiting for review', async () => {
    const result = await seedDemo(context, { fixturesDir: FIXTURES_DIR });

    const scans = await context.db
      .selectFrom('scan')
      .innerJoin('station', 'station.id', 'scan.station_id')
      .select(['scan.id', 'scan.status', 'station.code'])
      .orderBy('scan.status')
      .execute();
    expect(scans).toEqual([
      { id: result.tracedScanId, status: 'approved', code: 'KRO' },
      { id: result.readyScanId, status: 'ready_to_trace', code: 'KRO' },
      { id: result.waitingScanId, status: 'traced', code: 'KRO' },
    ]);
    const lines = await context.db.selectFrom('ink_line').select(['scan_id', 'status']).orderBy('status').execute();
    expect(lines).toEqual([
      { scan_id: result.tracedScanId, status: 'approved' },
      { scan_id: result.waitingScanId, status: 'handed_in' },
    ]);
    // The waiting line came with chart on / chart off and two check readings, so Review shows both corrections.
    const waitingResult = await context.db.selectFrom('ink_line').select('result').where('scan_id', '=', result.waitingScanId).executeTakeFirstOrThrow();
    expect(waitingResult.result?.summary.clock).toMatchObject({ markCount: 2 });
    expect(waitingResult.result?.summary.instrument).toMatchObject({ readingCount: 2 });
    expect(Math.abs(waitingResult.result?.summary.instrument?.meanOffsetHpa ?? 99)).toBeLessThan(0.2);
    const { count } = await context.db
      .selectFrom('series_point')
      .select((eb) => eb.fn.countAll<number>().as('count'))
      .executeTakeFirstOrThrow();
    // The sample is a weekly chart: well over a hundred hourly points.
    expect(count).toBeGreaterThan(100);

    // The demo teacher has a finished lesson on the traced chart's front, shared by a link.
    const lessons = await context.db.selectFrom('lesson').select(['id', 'title', 'notes', 'questions', 'candidate_decisions']).execute();
    expect(lessons.map((lesson) => lesson.title)).toEqual([DEMO_LESSON_TITLE]);
    const [lesson] = lessons;
    expect(lesson.notes).toHaveLength(1);
    expect(lesson.notes[0]).toMatchObject({ kind: 'cold_front', showDerived: true });
    expect(lesson.candidate_decisions).toEqual({ [lesson.notes[0].candidateKey as string]: 'accepted' });
    expect(lesson.questions).toHaveLength(1);
    expect(await context.db.selectFrom('lesson_share').select('id').where('lesson_id', '=', lesson.id).execute()).toHaveLength(1);
  });

  it('when an earlier seed stopped after its uploads, then running it again finishes without a second copy', async () => {
    const first = await seedDemo(context, { fixturesDir: FIXTURES_DIR });
    await context.db.deleteFrom('demo_seed').execute();
    await context.db.deleteFrom('ink_line').execute();
    // Stopped after its uploads: the scans were never traced.
    await context.db.updateTable('scan').set({ status: 'ready_to_trace' }).execute();

    const again = await seedDemo(context, { fixturesDir: FIXTURES_DIR });

    expect(again).toEqual({ ...first, isSeeded: true });
    expect(await context.db.selectFrom('scan').select('id').execute()).toHaveLength(3);
    expect(await context.db.selectFrom('ink_line').select('id').execute()).toHaveLength(2);
    expect(await context.db.selectFrom('lesson').select('id').execute()).toHaveLength(1);
  });
});
