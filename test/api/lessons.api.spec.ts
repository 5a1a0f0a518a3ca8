import request from 'supertest';
import type { LessonDetail, LessonPassage, SharedLesson } from '@shared/api/lessons';
import { API, IIIF } from '@shared/api/routes';
import { findFrontCandidates } from '@shared/domain/front-candidates';
import { threeHourTendency } from '@shared/domain/pressure-tendency';
import { createChartForm, createPerson, createStation, TEST_WEEKLY_FORM, type TestPerson } from '../helpers/factories';
import { createTracedFrontScan, FRONT_HOUR } from '../helpers/lesson-fixtures';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

const CHART_START = '2026-03-02T00:00:00.000Z';
const FRONT_TIME = new Date(Date.parse(CHART_START) + FRONT_HOUR * 3_600_000).toISOString();
const PASSAGE = { from: '2026-03-02T12:00:00Z', to: '2026-03-04T12:00:00Z' };

describe('lessons', () => {
  let context: TestContext;
  let teacher: TestPerson;
  let otherTeacher: TestPerson;
  let admin: TestPerson;
  let stationId: string;
  let emptyStationId: string;
  let scanId: string;

  const as = (person: TestPerson) => ({
    get: (path: string) => request(context.app).get(path).set('Authorization', `Bearer ${person.token}`),
    post: (path: string) => request(context.app).post(path).set('Authorization', `Bearer ${person.token}`),
    patch: (path: string) => request(context.app).patch(path).set('Authorization', `Bearer ${person.token}`),
    delete: (path: string) => request(context.app).delete(path).set('Authorization', `Bearer ${person.token}`),
  });

  async function createLesson(person: TestPerson, overrides: Record<string, unknown> = {}): Promise<LessonDetail> {
    const response = await as(person)
      .post(API.lessons)
      .send({ title: 'A cold front at Test Station', audience: 'Year 10', description: 'Two days around a front.', stationId, ...PASSAGE, ...overrides });
    expect(response.status).toBe(201);
    return response.body as LessonDetail;
  }

  async function share(person: TestPerson, lessonId: string, expiresAt: string | null = null): Promise<{ id: string; token: string }> {
    const response = await as(person).post(API.lessonShares(lessonId)).send({ expiresAt });
    expect(response.status).toBe(201);
    return response.body;
  }

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    teacher = await createPerson(context.db, ['teacher']);
    otherTeacher = await createPerson(context.db, ['teacher']);
    admin = await createPerson(context.db, ['admin']);
    const archivist = await createPerson(context.db, ['archivist']);
    const volunteer = await createPerson(context.db, ['volunteer']);
    stationId = (await createStation(context.db)).id;
    emptyStationId = (await createStation(context.db)).id;
    const form = await createChartForm(context.db);
    ({ scanId } = await createTracedFrontScan(context, {
      stationId,
      chartFormId: form.id,
      form: { ...TEST_WEEKLY_FORM, name: form.name },
      chartStart: CHART_START,
      archivistId: archivist.id,
      volunteerId: volunteer.id,
    }));
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  describe('building', () => {
    it('when a teacher starts a lesson from a station and a window, then it is stored as theirs at version 1', async () => {
      const lesson = await createLesson(teacher);

      expect(lesson).toMatchObject({ title: 'A cold front at Test Station', stationId, ownerId: teacher.id, version: 1, notes: [], questions: [], isEditable: true });
      expect(lesson.from).toBe('2026-03-02T12:00:00.000Z');
      const row = await context.db.selectFrom('lesson').selectAll().where('id', '=', lesson.id).executeTakeFirstOrThrow();
      expect(row.owner_id).toBe(teacher.id);
      expect(row.passage_to.toISOString()).toBe('2026-03-04T12:00:00.000Z');
    });

    it('when the lesson has bad or unknown fields, then it is refused with a 400 naming each one and nothing is stored', async () => {
      const before = await context.db.selectFrom('lesson').select((eb) => eb.fn.countAll<string>().as('n')).executeTakeFirstOrThrow();

      const response = await as(teacher)
        .post(API.lessons)
        .send({ title: '', audience: 'x', description: '', stationId: 'nope', from: '2026-03-04T00:00Z', to: '2026-03-02T00:00Z', colour: 'red' });

      expect(response.status).toBe(400);
      expect(response.body.error.code).toBe('validation_failed');
      expect(Object.keys(response.body.error.details)).toEqual(expect.arrayContaining(['title', 'stationId', 'colour']));
      const after = await context.db.selectFrom('lesson').select((eb) => eb.fn.countAll<string>().as('n')).executeTakeFirstOrThrow();
      expect(after.n).toBe(before.n);
    });

    it('when the window is backwards or longer than a fortnight, then the 400 names `to`', async () => {
      const backwards = await as(teacher).post(API.lessons).send({ title: 'x', audience: '', description: '', stationId, from: PASSAGE.to, to: PASSAGE.from });
      const long = await as(teacher).post(API.lessons).send({ title: 'x', audience: '', description: '', stationId, from: '2026-03-01T00:00Z', to: '2026-04-01T00:00Z' });

      expect(backwards.status).toBe(400);
      expect(backwards.body.error.details.to).toMatch(/after/);
      expect(long.body.error.details.to).toMatch(/14 days/);
    });

    it('when the passage is read, then it holds the station series, the front candidates of shared/domain and the scan region with its ink line', async () => {
      const lesson = await createLesson(teacher);

      const response = await as(teacher).get(API.lessonPassage(lesson.id));

      expect(response.status).toBe(200);
      const passage = response.body as LessonPassage;
      const series = await as(teacher).get(API.series).query({ stationId, ...PASSAGE }).set('Authorization', `Bearer ${teacher.token}`);
      expect(passage.points).toEqual(series.body.points);
      // The candidates are exactly findFrontCandidates of the series (the function is tested against its sources).
      const expected = findFrontCandidates(passage.points.map((p) => ({ timeMs: Date.parse(p.time), pressureHpa: p.pressureHpa })));
      expect(passage.candidates.map((c) => [c.kind, c.time])).toEqual(expected.map((c) => [c.kind, new Date(c.timeMs).toISOString()]));
      expect(passage.candidates.find((c) => c.kind === 'front')?.time).toBe(FRONT_TIME);
      expect(passage.regions).toHaveLength(1);
      const [region] = passage.regions;
      expect(region.scanId).toBe(scanId);
      expect(region.inkLine.length).toBeGreaterThan(10);
      for (const knot of region.inkLine) {
        expect(knot.xPx).toBeGreaterThanOrEqual(region.region.xPx);
        expect(knot.xPx).toBeLessThanOrEqual(region.region.xPx + region.region.widthPx);
      }
      expect(Date.parse(region.from)).toBeGreaterThanOrEqual(Date.parse(PASSAGE.from));
      expect(Date.parse(region.to)).toBeLessThanOrEqual(Date.parse(PASSAGE.to));
      const image = await as(teacher).get(region.imagePath);
      expect(image.status).toBe(200);
      expect(image.headers['content-type']).toBe('image/jpeg');
    });

    it('when notes, questions and decisions are saved with the version read, then they are kept, with derived values beside a note that asks for them', async () => {
      const lesson = await createLesson(teacher);
      const note = {
        kind: 'cold_front',
        text: 'The pressure bottoms out and then climbs fast.',
        time: FRONT_TIME,
        endTime: null,
        mark: { scanId, shape: 'box', xPx: 500, yPx: 200, widthPx: 60, heightPx: 40 },
        showDerived: true,
        candidateKey: `front@${FRONT_TIME}`,
      };
      const rise = { ...note, kind: 'pressure_jump', text: 'Behind it', time: FRONT_TIME, endTime: new Date(Date.parse(FRONT_TIME) + 3 * 3_600_000).toISOString(), mark: null, candidateKey: null };

      const response = await as(teacher)
        .patch(API.lesson(lesson.id))
        .send({
          version: 1,
          notes: [note, rise],
          questions: [{ text: 'When did the front pass?', answer: 'Near 16:00 UTC on 3 March' }],
          candidateDecisions: { [`front@${FRONT_TIME}`]: 'accepted', [`pressure_jump@${FRONT_TIME}`]: 'dismissed' },
        });

      expect(response.status).toBe(200);
      const saved = response.body as LessonDetail;
      expect(saved.version).toBe(2);
      expect(saved.notes).toHaveLength(2);
      expect(saved.notes[0].id).toMatch(/^[0-9a-f-]{36}$/);
      expect(saved.questions[0]).toMatchObject({ text: 'When did the front pass?', answer: 'Near 16:00 UTC on 3 March' });
      const passage = (await as(teacher).get(API.lessonPassage(lesson.id))).body as LessonPassage;
      const samples = passage.points.map((p) => ({ timeMs: Date.parse(p.time), pressureHpa: p.pressureHpa }));
      // The tendency is threeHourTendency's (WMO-No. 306 code table 0200, tested in pressure-tendency.spec.ts).
      const atFront = threeHourTendency(samples, Date.parse(FRONT_TIME));
      const pointNote = saved.notes.find((n) => n.endTime === null);
      expect(pointNote?.derived?.tendency?.group).toBe(atFront?.group);
      // Over the three hours behind the trough the invented curve rises 2.5 hPa/h (test/helpers/lesson-fixtures.ts).
      const spanNote = saved.notes.find((n) => n.endTime !== null);
      expect(spanNote?.derived?.change?.changeHpa).toBeCloseTo(7.5, 0);
      expect(spanNote?.derived?.change?.rateHpaPerHour).toBeCloseTo(2.5, 0);
      const row = await context.db.selectFrom('lesson').selectAll().where('id', '=', lesson.id).executeTakeFirstOrThrow();
      expect(row.version).toBe(2);
      expect(row.notes).toHaveLength(2);
      expect(row.candidate_decisions).toEqual({ [`front@${FRONT_TIME}`]: 'accepted', [`pressure_jump@${FRONT_TIME}`]: 'dismissed' });
    });

    it('when a save carries a stale version, then it is a 409 version_conflict with the current version and nothing changes', async () => {
      const lesson = await createLesson(teacher);
      await as(teacher).patch(API.lesson(lesson.id)).send({ version: 1, title: 'First edit' });

      const response = await as(teacher).patch(API.lesson(lesson.id)).send({ version: 1, title: 'Late edit' });

      expect(response.status).toBe(409);
      expect(response.body.error).toMatchObject({ code: 'version_conflict', details: { currentVersion: 2 } });
      const row = await context.db.selectFrom('lesson').select(['title', 'version']).where('id', '=', lesson.id).executeTakeFirstOrThrow();
      expect(row).toEqual({ title: 'First edit', version: 2 });
    });

    it('when a note is malformed, then the 400 names its path', async () => {
      const lesson = await createLesson(teacher);

      const response = await as(teacher)
        .patch(API.lesson(lesson.id))
        .send({ version: 1, notes: [{ kind: 'tornado', text: '', time: 'noon', endTime: null, mark: null, showDerived: false, candidateKey: null }] });

      expect(response.status).toBe(400);
      expect(response.body.error.details).toEqual(expect.objectContaining({ 'notes.0.kind': expect.any(String), 'notes.0.time': expect.any(String) }));
    });

    it('when a teacher deletes their lesson with its version, then it is gone; with a stale one it stays', async () => {
      const lesson = await createLesson(teacher);

      const stale = await as(teacher).delete(API.lesson(lesson.id)).query({ version: 7 });
      const deleted = await as(teacher).delete(API.lesson(lesson.id)).query({ version: 1 });

      expect(stale.status).toBe(409);
      expect(deleted.status).toBe(204);
      expect(await context.db.selectFrom('lesson').select('id').where('id', '=', lesson.id).executeTakeFirst()).toBeUndefined();
    });
  });

  describe('who may see and change a lesson', () => {
    it('when another teacher asks for a private lesson, then it is 404 for reading, changing and copying', async () => {
      const lesson = await createLesson(teacher);

      const read = await as(otherTeacher).get(API.lesson(lesson.id));
      const change = await as(otherTeacher).patch(API.lesson(lesson.id)).send({ version: 1, title: 'Mine now' });
      const copy = await as(otherTeacher).post(API.lessonCopy(lesson.id));

      expect([read.status, change.status, copy.status]).toEqual([404, 404, 404]);
      expect(read.body.error.code).toBe('lesson_not_found');
      const row = await context.db.selectFrom('lesson').select('title').where('id', '=', lesson.id).executeTakeFirstOrThrow();
      expect(row.title).toBe('A cold front at Test Station');
    });

    it('when the lesson is shared, then another teacher may read and copy it but not change it or its links', async () => {
      const lesson = await createLesson(teacher);
      await as(teacher).patch(API.lesson(lesson.id)).send({ version: 1, questions: [{ text: 'Why?', answer: null }] });
      await share(teacher, lesson.id);

      const read = await as(otherTeacher).get(API.lesson(lesson.id));
      const change = await as(otherTeacher).patch(API.lesson(lesson.id)).send({ version: 2, title: 'Mine now' });
      const links = await as(otherTeacher).get(API.lessonShares(lesson.id));
      const copy = await as(otherTeacher).post(API.lessonCopy(lesson.id));

      expect(read.status).toBe(200);
      expect(read.body.isEditable).toBe(false);
      expect(change.status).toBe(403);
      expect(links.status).toBe(403);
      expect(copy.status).toBe(201);
      expect(copy.body).toMatchObject({ ownerId: otherTeacher.id, copiedFromId: lesson.id, title: 'A cold front at Test Station (copy)', version: 1 });
      expect(copy.body.questions[0].text).toBe('Why?');
      expect(copy.body.questions[0].id).not.toBe(read.body.questions[0].id);
      const copied = await context.db.selectFrom('lesson').select(['owner_id']).where('id', '=', copy.body.id).executeTakeFirstOrThrow();
      expect(copied.owner_id).toBe(otherTeacher.id);
    });

    it('when an admin changes a teacher lesson, then it is allowed', async () => {
      const lesson = await createLesson(teacher);

      const response = await as(admin).patch(API.lesson(lesson.id)).send({ version: 1, audience: 'Sixth form' });

      expect(response.status).toBe(200);
      expect(response.body.audience).toBe('Sixth form');
    });

    it('when the lists are read, then mine, shared and others hold the right lessons, paged on the server', async () => {
      const own = await createLesson(otherTeacher, { title: 'Own private' });
      const sharedOwn = await createLesson(otherTeacher, { title: 'Own shared' });
      const link = await share(otherTeacher, sharedOwn.id);

      const mine = await as(otherTeacher).get(API.lessons).query({ scope: 'mine', pageSize: 1 });
      const shared = await as(otherTeacher).get(API.lessons).query({ scope: 'shared' });
      const others = await as(teacher).get(API.lessons).query({ scope: 'others', pageSize: 200 });
      const bad = await as(teacher).get(API.lessons).query({ scope: 'everyone' });

      expect(mine.status).toBe(200);
      expect(mine.body.items).toHaveLength(1);
      const mineTotal = await context.db.selectFrom('lesson').select((eb) => eb.fn.countAll<string>().as('n')).where('owner_id', '=', otherTeacher.id).executeTakeFirstOrThrow();
      expect(mine.body.total).toBe(Number(mineTotal.n));
      expect(shared.body.items.map((l: { id: string }) => l.id)).toEqual([sharedOwn.id]);
      expect(shared.body.items[0].liveShares[0].token).toBe(link.token);
      expect(others.body.items.map((l: { id: string }) => l.id)).toContain(sharedOwn.id);
      expect(others.body.items.map((l: { id: string }) => l.id)).not.toContain(own.id);
      expect(others.body.items.every((l: { liveShares: unknown[] }) => l.liveShares.length === 0)).toBe(true);
      expect(bad.status).toBe(400);
      expect(bad.body.error.details.scope).toBeDefined();
    });
  });

  describe('share links', () => {
    it('when a share link is opened without signing in, then it shows the lesson, counts the opening and names no scan or person', async () => {
      const lesson = await createLesson(teacher);
      await as(teacher)
        .patch(API.lesson(lesson.id))
        .send({
          version: 1,
          notes: [{ kind: 'cold_front', text: 'Here', time: FRONT_TIME, endTime: null, mark: { scanId, shape: 'point', xPx: 600, yPx: 300, widthPx: null, heightPx: null }, showDerived: false, candidateKey: null }],
          questions: [{ text: 'When?', answer: 'At the trough' }],
        });
      const link = await share(teacher, lesson.id);

      const response = await request(context.app).get(API.sharedLesson(link.token));

      expect(response.status).toBe(200);
      expect(response.headers['x-robots-tag']).toMatch(/noindex/);
      const shared = response.body as SharedLesson;
      expect(shared.title).toBe('A cold front at Test Station');
      expect(shared.notes[0].mark).toMatchObject({ shape: 'point', regionIndex: 0 });
      expect(shared.questions[0].answer).toBe('At the trough');
      expect(shared.passage.regions[0].imagePath).toBe(`/api/shared/${link.token}/regions/0/image.jpg`);
      const text = JSON.stringify(response.body);
      expect(text).not.toContain(scanId);
      expect(text).not.toContain(teacher.id);
      expect(text).not.toContain(lesson.id);
      const image = await request(context.app).get(shared.passage.regions[0].imagePath);
      expect(image.status).toBe(200);
      expect(image.headers['content-type']).toBe('image/jpeg');
      const row = await context.db.selectFrom('lesson_share').select(['open_count', 'last_opened_at']).where('id', '=', link.id).executeTakeFirstOrThrow();
      expect(row.open_count).toBe(1);
      expect(row.last_opened_at).not.toBeNull();
      const links = await as(teacher).get(API.lessonShares(lesson.id));
      expect(links.body.items[0]).toMatchObject({ id: link.id, openCount: 1, isLive: true });
    });

    it('when the share token is used for anything else, then every other route and image is refused', async () => {
      const lesson = await createLesson(teacher, { stationId: emptyStationId });
      const link = await share(teacher, lesson.id);
      const bearer = `Bearer ${link.token}`;

      const responses = await Promise.all([
        request(context.app).get(API.series).query({ stationId, ...PASSAGE }).set('Authorization', bearer),
        request(context.app).get(API.lessons).set('Authorization', bearer),
        request(context.app).get(API.scan(scanId)).set('Authorization', bearer),
        request(context.app).get(IIIF.info(scanId)).set('Authorization', bearer),
        request(context.app).get(IIIF.image(scanId, 'full', '!100,100')).set('Authorization', bearer),
        request(context.app).get(`/api/shared/${link.token}/regions/0/image.jpg`),
        request(context.app).get(`/api/shared/${link.token}/scans/${scanId}`),
        request(context.app).get(`/api/shared/${link.token}/series`),
        request(context.app).get(`/api/shared/${link.token}/regions/0/../../../scans/${scanId}`),
      ]);

      expect(responses.map((r) => r.status)).toEqual([401, 401, 401, 401, 401, 404, 404, 404, 404]);
    });

    it('when a link is revoked or has expired, then its page and its images are refused', async () => {
      const lesson = await createLesson(teacher);
      const revoked = await share(teacher, lesson.id);
      const expired = await share(teacher, lesson.id, new Date(Date.now() + 60_000).toISOString());
      const revoke = await as(teacher).patch(API.lessonShare(lesson.id, revoked.id)).send({ revoked: true });
      await context.db.updateTable('lesson_share').set({ expires_at: new Date(Date.now() - 1000) }).where('id', '=', expired.id).execute();

      const pages = await Promise.all([revoked, expired].map((link) => request(context.app).get(API.sharedLesson(link.token))));
      const images = await Promise.all([revoked, expired].map((link) => request(context.app).get(`/api/shared/${link.token}/regions/0/image.jpg`)));
      const unknown = await request(context.app).get(API.sharedLesson('x'.repeat(43)));

      expect(revoke.status).toBe(200);
      expect(revoke.body).toMatchObject({ isLive: false });
      expect(revoke.body.revokedAt).not.toBeNull();
      expect(pages.map((r) => r.status)).toEqual([404, 404]);
      expect(pages[0].body.error.code).toBe('share_link_not_found');
      expect(images.map((r) => r.status)).toEqual([404, 404]);
      expect(unknown.status).toBe(404);
      const rows = await context.db.selectFrom('lesson_share').select('open_count').where('lesson_id', '=', lesson.id).execute();
      expect(rows.every((row) => row.open_count === 0)).toBe(true);
    });

    it('when a link is given an expiry in the past at creation, then it is refused; a later expiry can be set and cleared', async () => {
      const lesson = await createLesson(teacher);
      const past = await as(teacher).post(API.lessonShares(lesson.id)).send({ expiresAt: '2020-01-01T00:00Z' });
      const link = await share(teacher, lesson.id);

      const set = await as(teacher).patch(API.lessonShare(lesson.id, link.id)).send({ expiresAt: '2099-01-01T00:00Z' });
      const cleared = await as(teacher).patch(API.lessonShare(lesson.id, link.id)).send({ expiresAt: null });
      const empty = await as(teacher).patch(API.lessonShare(lesson.id, link.id)).send({});

      expect(past.status).toBe(400);
      expect(past.body.error.details.expiresAt).toBeDefined();
      expect(set.body.expiresAt).toBe('2099-01-01T00:00:00.000Z');
      expect(cleared.body.expiresAt).toBeNull();
      expect(empty.status).toBe(400);
    });

    it('when the client share page is fetched, then it carries X-Robots-Tag noindex', async () => {
      const response = await request(context.app).get('/shared/some-token-value-that-is-long');

      expect(response.headers['x-robots-tag']).toMatch(/noindex/);
    });
  });

  describe('Web Annotation export', () => {
    it('when the notes are exported, then they form an AnnotationCollection with the Data Model required properties and fragment-selected targets', async () => {
      const lesson = await createLesson(teacher);
      const spanEnd = new Date(Date.parse(FRONT_TIME) + 3 * 3_600_000).toISOString();
      await as(teacher)
        .patch(API.lesson(lesson.id))
        .send({
          version: 1,
          notes: [
            { kind: 'cold_front', text: 'Trough', time: FRONT_TIME, endTime: null, mark: { scanId, shape: 'box', xPx: 500.4, yPx: 200, widthPx: 60, heightPx: 40 }, showDerived: false, candidateKey: null },
            { kind: 'ridge', text: '', time: FRONT_TIME, endTime: spanEnd, mark: null, showDerived: false, candidateKey: null },
          ],
        });

      const response = await as(teacher).get(API.lessonAnnotations(lesson.id));

      expect(response.status).toBe(200);
      expect(response.headers['content-type']).toMatch(/^application\/ld\+json; profile="http:\/\/www\.w3\.org\/ns\/anno\.jsonld"/);
      const collection = JSON.parse(response.text);
      // Web Annotation Data Model (W3C Rec. 2017) §3.1 and §5: @context, IRI id, type on the annotation and the collection.
      expect(collection['@context']).toBe('http://www.w3.org/ns/anno.jsonld');
      expect(collection.type).toBe('AnnotationCollection');
      expect(collection.id).toMatch(/^http:\/\//);
      expect(collection.total).toBe(2);
      expect(collection.first.type).toBe('AnnotationPage');
      const [boxNote, spanNote] = collection.first.items;
      for (const annotation of collection.first.items) {
        // §3.1: an Annotation MUST have id and type "Annotation", and MUST have at least one target.
        expect(annotation.id).toMatch(/^http:\/\/.+\/annotations\/[0-9a-f-]{36}$/);
        expect(annotation.type).toBe('Annotation');
        expect(annotation.target.length).toBeGreaterThanOrEqual(1);
        // §3.2.4 TextualBody: a value; §4.2.1 FragmentSelector: a value and conformsTo the Media Fragments spec.
        for (const body of annotation.body) expect(body).toMatchObject({ type: 'TextualBody', value: expect.any(String) });
        for (const target of annotation.target) {
          expect(target.type).toBe('SpecificResource');
          expect(target.source.id).toMatch(/^http:\/\//);
          expect(target.selector).toMatchObject({ type: 'FragmentSelector', conformsTo: 'http://www.w3.org/TR/media-frags/' });
        }
      }
      expect(boxNote.target[0].selector.value).toBe(`t=clock:${FRONT_TIME}`);
      expect(boxNote.target[0].source.id).toContain(`/api/series?stationId=${stationId}`);
      expect(boxNote.target[1].source).toMatchObject({ type: 'Canvas' });
      expect(boxNote.target[1].source.id).toMatch(new RegExp(`/iiif/3/${scanId}/canvas/1$`));
      expect(boxNote.target[1].selector.value).toBe('xywh=500,200,60,40');
      expect(boxNote.body.map((b: { purpose: string }) => b.purpose)).toEqual(['commenting', 'tagging']);
      expect(spanNote.target).toHaveLength(1);
      expect(spanNote.target[0].selector.value).toBe(`t=clock:${FRONT_TIME},${spanEnd}`);
      expect(spanNote.body).toEqual([expect.objectContaining({ value: 'Ridge', purpose: 'tagging' })]);
    });
  });
});

describe('share link rate limit', () => {
  let context: TestContext;

  beforeAll(async () => {
    context = await createTestContext();
  });

  afterAll(async () => {
    await context.close();
  });

  // 302 requests: allow for a loaded machine.
  it('when one address asks for share links too often, then it gets 429 rate_limited', async () => {
    const token = 'y'.repeat(43);
    const statuses: number[] = [];

    for (let i = 0; i < 301; i++) statuses.push((await request(context.app).get(API.sharedLesson(token))).status);
    const last = await request(context.app).get(API.sharedLesson(token));

    expect(statuses.slice(0, 300).every((status) => status === 404)).toBe(true);
    expect(last.status).toBe(429);
    expect(last.body.error.code).toBe('rate_limited');
  }, 30_000);
});
