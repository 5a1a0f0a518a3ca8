import { createHash } from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';
import request from 'supertest';
import { API } from '@shared/api/routes';
import type { ScanDetail } from '@shared/api/scans';
import { createChartForm, createPerson, createStation, type TestPerson } from '../helpers/factories';
import { makeGifBytes, makeJpeg, makePng, makeTruncatedPng } from '../helpers/images';
import { createTestContext, listFiles, type TestContext, truncateTables } from '../helpers/test-app';

const PERIOD_START = '2026-03-02T00:00Z';

describe('scan upload', () => {
  let context: TestContext;
  let archivist: TestPerson;
  let volunteer: TestPerson;
  let stationId: string;
  let chartFormId: string;

  function upload(file: Buffer, fileName: string, fields: Record<string, string> = { stationId, chartFormId, chartStart: PERIOD_START }) {
    let call = request(context.app).post(API.scans).set('Authorization', `Bearer ${archivist.token}`);
    for (const [name, value] of Object.entries(fields)) call = call.field(name, value);
    return call.attach('file', file, fileName);
  }

  async function scanRowCount(): Promise<number> {
    const { count } = await context.db.selectFrom('scan').select((eb) => eb.fn.countAll<number>().as('count')).executeTakeFirstOrThrow();
    return count;
  }

  beforeAll(async () => {
    context = await createTestContext();
  });

  beforeEach(async () => {
    await truncateTables(context.db);
    await fs.rm(path.join(context.storage.rootDir, 'masters'), { recursive: true, force: true });
    await fs.rm(path.join(context.storage.rootDir, 'previews'), { recursive: true, force: true });
    await context.storage.ensureFolders();
    archivist = await createPerson(context.db, ['archivist']);
    volunteer = await createPerson(context.db, ['volunteer']);
    stationId = (await createStation(context.db)).id;
    chartFormId = (await createChartForm(context.db)).id;
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when a PNG is uploaded with station, chart form and chart start, then it is stored by hash, received until its derivatives exist', async () => {
    const png = await makePng(80, 40);
    const sha256 = createHash('sha256').update(png).digest('hex');

    const response = await upload(png, 'kro-week-10.png');

    expect(response.status).toBe(201);
    const scan = response.body as ScanDetail;
    expect(scan).toMatchObject({
      stationId,
      chartFormId,
      chartStart: '2026-03-02T00:00:00.000Z',
      status: 'received',
      originalName: 'kro-week-10.png',
      mediaType: 'image/png',
      sizeBytes: png.length,
      widthPx: 80,
      heightPx: 40,
      sha256,
      inkLineCount: 0,
    });
    const row = await context.db.selectFrom('scan').selectAll().where('id', '=', scan.id).executeTakeFirstOrThrow();
    expect(row.storage_key).toBe(`masters/${sha256.slice(0, 2)}/${sha256}.png`);
    expect(row.uploaded_by).toBe(archivist.id);
    expect(row.status).toBe('received');
    expect(await fs.readFile(context.storage.pathOf(row.storage_key))).toEqual(png);
    expect(await listFiles(path.join(context.storage.rootDir, 'tmp'))).toEqual([]);
  });

  it('when a JPEG with a UTF-8 name is uploaded, then it is kept as image/jpeg with a .jpg master and its name intact', async () => {
    const jpeg = await makeJpeg(120, 90);
    const sha256 = createHash('sha256').update(jpeg).digest('hex');

    const response = await upload(jpeg, 'Saltmere–day 3.jpeg');

    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({ mediaType: 'image/jpeg', widthPx: 120, heightPx: 90, sha256, originalName: 'Saltmere–day 3.jpeg' });
    expect(await listFiles(path.join(context.storage.rootDir, 'masters'))).toEqual([`${sha256.slice(0, 2)}/${sha256}.jpg`]);
  });

  it('when the bytes are not PNG or JPEG although the name ends in .png, then it answers 415 and keeps nothing', async () => {
    const response = await upload(makeGifBytes(), 'looks-like.png');

    expect(response.status).toBe(415);
    expect(response.body.error.code).toBe('unsupported_file_type');
    expect(await scanRowCount()).toBe(0);
    expect(await listFiles(context.storage.rootDir)).toEqual([]);
  });

  it('when the bytes are plain text, then it answers 415 unsupported_file_type', async () => {
    const response = await upload(Buffer.from('time,pressure\n2026-03-02T00:00Z,1000\n'), 'chart.png');

    expect(response.status).toBe(415);
    expect(response.body.error.code).toBe('unsupported_file_type');
    expect(await scanRowCount()).toBe(0);
  });

  it('when the image is cut short, then it answers 422 corrupt_image and keeps nothing', async () => {
    const response = await upload(await makeTruncatedPng(), 'torn.png');

    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('corrupt_image');
    expect(await scanRowCount()).toBe(0);
    expect(await listFiles(context.storage.rootDir)).toEqual([]);
  });

  it('when the same bytes are uploaded twice, then the second answers 409 with the first scan id and one file is stored', async () => {
    const png = await makePng();
    const first = await upload(png, 'first.png');

    const second = await upload(png, 'second-name.png');

    expect(first.status).toBe(201);
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('duplicate_scan');
    expect(second.body.error.details).toEqual({ scanId: first.body.id, existingScanId: first.body.id });
    expect(await scanRowCount()).toBe(1);
    expect(await listFiles(path.join(context.storage.rootDir, 'masters'))).toHaveLength(1);
  });

  it('when the same bytes arrive twice at once, then exactly one upload wins and one master is stored', async () => {
    const png = await makePng(200, 100);

    const responses = await Promise.all([upload(png, 'a.png'), upload(png, 'b.png')]);

    expect(responses.map((response) => response.status).sort()).toEqual([201, 409]);
    expect(await scanRowCount()).toBe(1);
    expect(await listFiles(path.join(context.storage.rootDir, 'masters'))).toHaveLength(1);
  });

  it('when fields are missing or malformed, then it answers 400 validation_failed naming each field', async () => {
    const response = await upload(await makePng(), 'chart.png', { stationId: 'not-an-id', chartStart: '2/3/2026 00:00' });

    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(Object.keys(response.body.error.details).sort()).toEqual(['chartFormId', 'chartStart', 'stationId']);
    expect(await scanRowCount()).toBe(0);
  });

  it('when the file part is missing, then it answers 400 validation_failed for file', async () => {
    const response = await request(context.app)
      .post(API.scans)
      .set('Authorization', `Bearer ${archivist.token}`)
      .field('stationId', stationId)
      .field('chartFormId', chartFormId)
      .field('chartStart', PERIOD_START);

    expect(response.status).toBe(400);
    expect(response.body.error.details).toEqual({ file: expect.any(String) });
  });

  it('when the station does not exist, then it answers 404 station_not_found and keeps nothing', async () => {
    const response = await upload(await makePng(), 'chart.png', {
      stationId: '00000000-0000-4000-8000-000000000000',
      chartFormId,
      chartStart: PERIOD_START,
    });

    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('station_not_found');
    expect(await listFiles(context.storage.rootDir)).toEqual([]);
  });

  it('when the chart form does not exist, then it answers 404 chart_form_not_found', async () => {
    const response = await upload(await makePng(), 'chart.png', {
      stationId,
      chartFormId: '00000000-0000-4000-8000-000000000000',
      chartStart: PERIOD_START,
    });

    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('chart_form_not_found');
  });

  it('when the row cannot be written after the file was kept, then the new master and preview are removed', async () => {
    // The uploader's account is removed after their token was issued: the session check refuses the request
    // before the file is received, so nothing is kept (once the insert failed on its reference, later).
    await context.db.deleteFrom('person').where('id', '=', archivist.id).execute();

    const response = await upload(await makePng(), 'orphan.png');

    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('session_ended');
    expect(await scanRowCount()).toBe(0);
    expect(await listFiles(path.join(context.storage.rootDir, 'masters'))).toEqual([]);
    expect(await listFiles(path.join(context.storage.rootDir, 'previews'))).toEqual([]);
  });

  it('when a scan is larger than the preview size, then its preview is a JPEG with the longest side 2400 px', async () => {
    const uploaded = await upload(await makePng(3000, 300), 'wide.png');

    const response = await request(context.app)
      .get(API.scanPreview(uploaded.body.id))
      .set('Authorization', `Bearer ${volunteer.token}`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });

    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('image/jpeg');
    const metadata = await sharp(response.body as Buffer).metadata();
    expect(metadata.format).toBe('jpeg');
    expect(metadata.width).toBe(2400);
    expect(metadata.height).toBe(240);
  });

  it('when the preview cache was lost, then the preview route makes it again from the master', async () => {
    const uploaded = await upload(await makePng(100, 50), 'small.png');
    await fs.rm(path.join(context.storage.rootDir, 'previews'), { recursive: true, force: true });

    const response = await request(context.app).get(API.scanPreview(uploaded.body.id)).set('Authorization', `Bearer ${archivist.token}`);

    expect(response.status).toBe(200);
    expect(await listFiles(path.join(context.storage.rootDir, 'previews'))).toHaveLength(1);
  });

  it('when scans are listed with a status filter, then only scans in that state come back with their names', async () => {
    const ready = await upload(await makePng(), 'ready.png');
    const other = await upload(await makePng(), 'withdrawn.png');
    // No worker runs here, so the states are set as the worker and an archivist would leave them.
    await context.db.updateTable('scan').set({ status: 'ready_to_trace' }).where('id', '=', ready.body.id).execute();
    await context.db.updateTable('scan').set({ status: 'withdrawn' }).where('id', '=', other.body.id).execute();

    const response = await request(context.app)
      .get(API.scans)
      .query({ status: 'ready_to_trace', sort: 'originalName', direction: 'desc' })
      .set('Authorization', `Bearer ${volunteer.token}`);

    expect(response.status).toBe(200);
    expect(response.body.total).toBe(1);
    expect(response.body.items.map((scan: ScanDetail) => scan.id)).toEqual([ready.body.id]);
    expect(response.body.items[0].stationName).toMatch(/^Test Station/);
    expect(response.body.items[0].chartFormName).toMatch(/^Test form/);
  });

  it('when the status filter is not a scan state, then it answers 400 validation_failed', async () => {
    const response = await request(context.app).get(API.scans).query({ status: 'lost' }).set('Authorization', `Bearer ${archivist.token}`);

    expect(response.status).toBe(400);
    expect(response.body.error.details).toHaveProperty('status');
  });

  it('when a scan id is unknown or malformed, then it answers 404 scan_not_found', async () => {
    const unknown = await request(context.app).get(API.scan('00000000-0000-4000-8000-000000000000')).set('Authorization', `Bearer ${archivist.token}`);
    const malformed = await request(context.app).get(API.scan('12')).set('Authorization', `Bearer ${archivist.token}`);

    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe('scan_not_found');
    expect(malformed.status).toBe(404);
    expect(malformed.body.error.code).toBe('scan_not_found');
  });
});

describe('scan upload size limit', () => {
  let context: TestContext;
  let archivist: TestPerson;

  beforeAll(async () => {
    context = await createTestContext({ maxUploadBytes: 4096 });
    await truncateTables(context.db);
    archivist = await createPerson(context.db, ['archivist']);
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when the file is larger than MAX_UPLOAD_BYTES, then it answers 413 file_too_large and leaves no temp file', async () => {
    const station = await createStation(context.db);
    const form = await createChartForm(context.db);
    const big = Buffer.concat([await makePng(), Buffer.alloc(8192, 1)]);

    const response = await request(context.app)
      .post(API.scans)
      .set('Authorization', `Bearer ${archivist.token}`)
      .field('stationId', station.id)
      .field('chartFormId', form.id)
      .field('chartStart', PERIOD_START)
      .attach('file', big, 'big.png');

    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe('file_too_large');
    expect(await context.db.selectFrom('scan').select('id').execute()).toEqual([]);
    expect(await listFiles(context.storage.rootDir)).toEqual([]);
  });
});
