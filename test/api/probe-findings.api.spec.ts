import request from 'supertest';
import { API, IIIF } from '@shared/api/routes';
import { createChartForm, createPerson, createScanRow, createStation, type TestPerson } from '../helpers/factories';
import { makePng } from '../helpers/images';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

// The set-up uploads a scan (sharp decodes it and writes its preview).
jest.setTimeout(60_000);

/** The findings of the API probe (issue 13, section 3) that are closed here, each as it was found. */
describe('probe findings', () => {
  let context: TestContext;
  let archivist: TestPerson;
  let volunteer: TestPerson;
  let scanId: string;

  const as = (person: TestPerson, call: request.Test) => call.set('Authorization', `Bearer ${person.token}`);

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    archivist = await createPerson(context.db, ['archivist']);
    volunteer = await createPerson(context.db, ['volunteer']);
    const station = await createStation(context.db);
    const form = await createChartForm(context.db);
    const upload = await as(archivist, request(context.app).post(API.scans))
      .field('stationId', station.id)
      .field('chartFormId', form.id)
      .field('chartStart', '1931-03-02T08:00Z')
      .attach('file', await makePng(300, 200), 'probe.png');
    scanId = upload.body.id;
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  describe('4: NUL characters, huge page numbers and huge IIIF sizes', () => {
    it.each([
      ['the catalogue search', () => as(archivist, request(context.app).get(API.scans).query({ q: 'gale\u0000' })), 'q'],
      ['a station name', () => as(archivist, request(context.app).post(API.stations)).send({ code: 'NUL1', name: 'Nul\u0000Station', timeZone: 'UTC' }), 'name'],
      ['scan tags', () => as(archivist, request(context.app).patch(API.scan(scanId))).send({ version: 1, tags: ['ok', 'bad\u0000tag'] }), 'tags.1'],
    ])('when %s holds a NUL character, then it answers 400 naming the field', async (_what, call, field) => {
      const response = await call();

      expect(response.status).toBe(400);
      expect(response.body.error.code).toBe('validation_failed');
      expect(Object.keys(response.body.error.details)).toEqual([field]);
    });

    it('when a multipart field holds a NUL character, then the database backstop answers 400, not 500', async () => {
      const response = await as(archivist, request(context.app).post(API.scans)).field('observer', 'J.\u0000Penhallow').attach('file', await makePng(64, 48), 'nul.png');

      expect(response.status).toBe(400);
    });

    it.each([[API.scans], [API.people], [API.stations], [API.chartForms], [API.intakeBatches]])('when %s is asked for page 99999999999999999999, then it answers 400 naming page', async (path) => {
      const admin = await createPerson(context.db, ['admin', 'archivist']);

      const response = await as(admin, request(context.app).get(path).query({ page: '99999999999999999999' }));

      expect(response.status).toBe(400);
      expect(Object.keys(response.body.error.details)).toEqual(['page']);
    });

    it('when an IIIF size is over 65 535 px a side, then it answers 400 naming size', async () => {
      const response = await as(volunteer, request(context.app).get(IIIF.image(scanId, 'full', '^70000,10')));

      expect(response.status).toBe(400);
      expect(response.body.error.message).toMatch(/65535 px a side/);
    });
  });

  describe('5: operator-like and repeated query parameters', () => {
    it('when the scan list gets stationId[$ne], then it answers 400 naming it instead of dropping the filter', async () => {
      const response = await as(archivist, request(context.app).get(`${API.scans}?stationId[$ne]=x`));

      expect(response.status).toBe(400);
      expect(Object.keys(response.body.error.details)).toEqual(['stationId[$ne]']);
    });

    it('when a parameter is given twice, then it answers 400 naming it; the repeatable tag is still taken', async () => {
      const twice = await as(archivist, request(context.app).get(`${API.scans}?status=received&status=withdrawn`));
      const tags = await as(archivist, request(context.app).get(`${API.scans}?tag=gale&tag=faint`));

      expect(twice.status).toBe(400);
      expect(Object.keys(twice.body.error.details)).toEqual(['status']);
      expect(tags.status).toBe(200);
    });

    it('when a body has a field the route does not know, then it answers 400 naming it', async () => {
      const response = await request(context.app).post(API.signIn).send({ email: archivist.email, password: 'x', isAdmin: true });

      expect(response.status).toBe(400);
      expect(response.body.error.details).toEqual({ isAdmin: 'isAdmin is not a field of this request' });
    });
  });

  describe('6: the public base URL, not the Host header', () => {
    it('when a request forges its Host header, then the info.json id and the manifest name PUBLIC_URL only', async () => {
      const info = await as(volunteer, request(context.app).get(IIIF.info(scanId))).set('Host', 'evil.example');
      const manifest = await as(volunteer, request(context.app).get(IIIF.manifest(scanId))).set('Host', 'evil.example');

      expect(JSON.parse(info.text).id).toBe(`http://isallo.test${IIIF.imageBase(scanId)}`);
      expect(manifest.text).not.toContain('evil.example');
      expect(manifest.text).toContain('http://isallo.test/iiif/3/');
    });
  });

  describe('9: HSTS and frame rules', () => {
    it('when the app is not behind TLS, then no Strict-Transport-Security is sent, and the frame rules agree', async () => {
      const response = await request(context.app).get(API.health);

      expect(response.headers['strict-transport-security']).toBeUndefined();
      expect(response.headers['x-frame-options']).toBe('DENY');
      expect(response.headers['content-security-policy']).toContain("frame-ancestors 'none'");
    });

    it('when BEHIND_TLS is set, then Strict-Transport-Security is sent', async () => {
      const behindTls = await createTestContext({ behindTls: true });
      try {
        const response = await request(behindTls.app).get(API.health);

        expect(response.headers['strict-transport-security']).toMatch(/max-age=31536000/);
      } finally {
        await behindTls.close();
      }
    });
  });

  describe('8: withdrawn scans', () => {
    it('when a volunteer lists or opens a withdrawn scan, then it is not listed and opening it answers 404', async () => {
      const station = await createStation(context.db);
      const withdrawnId = await createScanRow(context.db, { stationId: station.id, chartFormId: null, uploadedBy: archivist.id, chartStart: null, status: 'withdrawn' });

      const list = await as(volunteer, request(context.app).get(API.scans).query({ stationId: station.id }));
      const open = await as(volunteer, request(context.app).get(API.scan(withdrawnId)));
      const image = await as(volunteer, request(context.app).get(IIIF.info(withdrawnId)));
      const archivistOpen = await as(archivist, request(context.app).get(API.scan(withdrawnId)));

      expect(list.body.items.map((scan: { id: string }) => scan.id)).not.toContain(withdrawnId);
      expect(open.status).toBe(404);
      expect(image.status).toBe(404);
      expect(archivistOpen.status).toBe(200);
    });
  });
});
