import fs from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';
import request from 'supertest';
import { API, IIIF } from '@shared/api/routes';
import type { ScanDetail } from '@shared/api/scans';
import { pgBossDerivativeJobs } from '../../server/jobs/job-boss';
import { createChartForm, createPerson, createStation, type TestPerson } from '../helpers/factories';
import { makePng } from '../helpers/images';
import { makeMultiPageTiff, makeScannedPdf } from '../helpers/scan-files';
import { clearStorage, createTestContext, listFiles, type TestContext, truncateTables, waitForDerivatives } from '../helpers/test-app';

// PDF pages are read in a child process and derivatives are made in the background: seconds, not milliseconds.
jest.setTimeout(60_000);

describe('scan derivatives worker', () => {
  let context: TestContext;
  let archivist: TestPerson;
  let batchId: string;

  async function sendFile(file: Buffer, fileName: string): Promise<string[]> {
    const response = await request(context.app).post(API.intakeBatchFiles(batchId)).set('Authorization', `Bearer ${archivist.token}`).attach('file', file, fileName);
    expect(response.status).toBe(201);
    return response.body.scans.map((scan: { id: string }) => scan.id);
  }

  async function derivativeFiles(scanId: string): Promise<string[]> {
    const row = await context.db.selectFrom('scan').select(['sha256', 'page_index']).where('id', '=', scanId).executeTakeFirstOrThrow();
    return listFiles(context.storage.pathOf(context.storage.derivativesKey(row.sha256, row.page_index)));
  }

  beforeAll(async () => {
    context = await createTestContext();
    await context.startWorker();
  });

  beforeEach(async () => {
    await truncateTables(context.db);
    await clearStorage(context.storage);
    archivist = await createPerson(context.db, ['archivist']);
    batchId = (await request(context.app).post(API.intakeBatches).set('Authorization', `Bearer ${archivist.token}`).send({ label: 'derivatives' })).body.id;
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when a PNG is stored, then the worker makes its thumbnail, preview and IIIF tiles and marks it ready', async () => {
    const [scanId] = await sendFile(await makePng(1300, 700), 'wide.png');

    const states = await waitForDerivatives(context.db, [scanId]);

    expect(states[scanId]).toBe('ready');
    const files = await derivativeFiles(scanId);
    expect(files).toContain('thumbnail.jpg');
    expect(files).toContain('tiles/info.json');
    // 1300 × 700 at 512 px tiles: scale factors 1, 2, 4; the top level is the whole image at 325 × 175.
    expect(files).toContain('tiles/0,0,512,512/512,512/0/default.jpg');
    expect(files).toContain('tiles/full/325,175/0/default.jpg');
    const thumbnail = await sharp(path.join(context.storage.pathOf(context.storage.derivativesKey((await scanRow(scanId)).sha256, 0)), 'thumbnail.jpg')).metadata();
    expect([thumbnail.width, thumbnail.height]).toEqual([256, 138]);
    const detail = (await request(context.app).get(API.scan(scanId)).set('Authorization', `Bearer ${archivist.token}`)).body as ScanDetail;
    expect(detail).toMatchObject({ derivativeState: 'ready', derivativeAttempts: 1, derivativeError: null });
  });

  /** An intake upload with station, chart form and chart start: one that may go to ready to trace by itself. */
  async function uploadWithFullMetadata(file: Buffer, name: string) {
    const station = await createStation(context.db);
    const form = await createChartForm(context.db);
    return request(context.app)
      .post(API.intakeBatchFiles(batchId))
      .set('Authorization', `Bearer ${archivist.token}`)
      .field('stationId', station.id)
      .field('chartFormId', form.id)
      .field('chartStart', '1931-03-02T08:00Z')
      .attach('file', file, name);
  }

  it('when a file comes with station, chart form and chart start, then it stays received until its derivatives exist, then is ready to trace', async () => {
    const response = await uploadWithFullMetadata(await makePng(300, 200), 'whole.png');
    const scanId = response.body.scans[0].id as string;
    const atUpload = response.body.scans[0] as ScanDetail;
    await waitForDerivatives(context.db, [scanId]);

    // The status route refuses ready to trace without derivatives (scan-status.ts); the upload keeps the same rule.
    expect(atUpload).toMatchObject({ status: 'received', derivativeState: 'queued' });
    const row = await scanRow(scanId);
    expect([row.status, row.derivative_state]).toEqual(['ready_to_trace', 'ready']);
    const log = await context.db.selectFrom('scan_audit').select(['action', 'person_id', 'changes']).where('scan_id', '=', scanId).orderBy('at').execute();
    expect(log.map((entry) => entry.action)).toEqual(['upload', 'status']);
    expect(log[1]).toMatchObject({ person_id: archivist.id, changes: { status: { before: 'received', after: 'ready_to_trace' } } });
  });

  it('when a received scan was moved by hand before its derivatives were made, then the worker leaves its status alone', async () => {
    const response = await uploadWithFullMetadata(await makePng(310, 200), 'withdrawn-early.png');
    const scanId = response.body.scans[0].id as string;

    const withdrawn = await request(context.app).post(API.scanStatus(scanId)).set('Authorization', `Bearer ${archivist.token}`).send({ status: 'withdrawn', reason: 'duplicate' });
    await waitForDerivatives(context.db, [scanId]);

    expect(withdrawn.status).toBe(200);
    expect((await scanRow(scanId)).status).toBe('withdrawn');
  });

  async function scanRow(scanId: string) {
    return context.db.selectFrom('scan').selectAll().where('id', '=', scanId).executeTakeFirstOrThrow();
  }

  it('when a two-page PDF is stored, then each page gets its own raster and tiles at the page image size', async () => {
    const scanIds = await sendFile(await makeScannedPdf(2, 150, 75, 150), 'two.pdf');

    const states = await waitForDerivatives(context.db, scanIds);

    expect(Object.values(states)).toEqual(['ready', 'ready']);
    for (const scanId of scanIds) {
      const files = await derivativeFiles(scanId);
      expect(files).toEqual(expect.arrayContaining(['page.tif', 'thumbnail.jpg', 'tiles/info.json', 'tiles/full/150,75/0/default.jpg']));
      const row = await scanRow(scanId);
      const raster = await sharp(path.join(context.storage.pathOf(context.storage.derivativesKey(row.sha256, row.page_index)), 'page.tif')).metadata();
      expect([raster.width, raster.height]).toEqual([150, 75]);
    }
  });

  it('when a TIFF page is stored, then its raster holds that page and the master is unchanged', async () => {
    const tiff = await makeMultiPageTiff(2, 200, 100);
    const scanIds = await sendFile(tiff, 'pair.tif');

    await waitForDerivatives(context.db, scanIds);

    const second = await scanRow(scanIds[1]);
    const rasterPath = path.join(context.storage.pathOf(context.storage.derivativesKey(second.sha256, 1)), 'page.tif');
    const fromRaster = await sharp(rasterPath).raw().toBuffer();
    const fromMaster = await sharp(tiff, { page: 1 }).raw().toBuffer();
    expect(fromRaster.equals(fromMaster)).toBe(true);
    expect((await fs.readFile(context.storage.pathOf(second.storage_key))).equals(tiff)).toBe(true);
  });

  it('when a job fails on its last try, then the scan ends failed with the reason, and retry queues it again', async () => {
    // A page raster that cannot be decoded: the master is a PNG, but its bytes were damaged after upload.
    // retryLimit 0, so the test does not wait through the production back-off.
    const [scanId] = await sendFile(await makePng(), 'damaged.png');
    await waitForDerivatives(context.db, [scanId]);
    const row = await scanRow(scanId);
    await fs.writeFile(context.storage.pathOf(row.storage_key), Buffer.from('no longer a PNG'));
    await context.db.updateTable('scan').set({ derivative_state: 'queued' }).where('id', '=', scanId).execute();
    await context.boss.send('scan-derivatives', { scanId }, { retryLimit: 0 });

    const states = await waitForDerivatives(context.db, [scanId]);
    const failed = await scanRow(scanId);
    const retried = await request(context.app).post(API.scanDerivativesRetry(scanId)).set('Authorization', `Bearer ${archivist.token}`);

    expect(states[scanId]).toBe('failed');
    expect(failed.derivative_error).toMatch(/unsupported image format|corrupt|input/i);
    expect(retried.status).toBe(200);
    expect(retried.body.derivativeState).toBe('queued');
  });

  it('when a master is missing from storage, then its job fails at once without retries and IIIF answers 404', async () => {
    const [scanId] = await sendFile(await makePng(), 'gone.png');
    await waitForDerivatives(context.db, [scanId]);
    const row = await scanRow(scanId);
    await fs.rm(context.storage.pathOf(row.storage_key));
    await context.db.updateTable('scan').set({ derivative_state: 'queued' }).where('id', '=', scanId).execute();
    await context.jobs.enqueue(context.db, [scanId]);

    const states = await waitForDerivatives(context.db, [scanId]);
    const failed = await scanRow(scanId);
    const image = await request(context.app).get(IIIF.image(scanId, '0,0,10,10', 'max')).set('Authorization', `Bearer ${archivist.token}`);

    expect(states[scanId]).toBe('failed');
    expect(failed.derivative_error).toMatch(/missing from storage/);
    expect(failed.derivative_attempts).toBe(2);
    expect(image.status).toBe(404);
  });

  it('when derivatives are ready, then a retry is refused with 409', async () => {
    const [scanId] = await sendFile(await makePng(), 'fine.png');
    await waitForDerivatives(context.db, [scanId]);

    const response = await request(context.app).post(API.scanDerivativesRetry(scanId)).set('Authorization', `Bearer ${archivist.token}`);

    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe('derivatives_not_failed');
  });

  it('when a crash left a scan working with a half-written folder and no job, then a new worker requeues it and finishes', async () => {
    // Stored without a job, as if the worker died after marking it working and the job was lost.
    const [scanId] = await sendFile(await makePng(600, 300), 'crash.png');
    await waitForDerivatives(context.db, [scanId]);
    const row = await scanRow(scanId);
    const folder = context.storage.pathOf(context.storage.derivativesKey(row.sha256, 0));
    await fs.rm(folder, { recursive: true });
    await fs.mkdir(path.join(context.storage.tempDir, 'half.derivatives', 'tiles'), { recursive: true });
    await context.db.updateTable('scan').set({ derivative_state: 'working' }).where('id', '=', scanId).execute();
    await context.db.deleteFrom('pgboss.job' as never).execute();

    const second = await context.startWorker();
    const states = await waitForDerivatives(context.db, [scanId]);
    await second.stop();

    expect(states[scanId]).toBe('ready');
    expect(await listFiles(folder)).toContain('tiles/info.json');
  });

  it('when scans are enqueued in a transaction that rolls back, then no job is left', async () => {
    const jobs = pgBossDerivativeJobs(context.boss);

    await context.db
      .transaction()
      .execute(async (trx) => {
        await jobs.enqueue(trx, ['00000000-0000-4000-8000-000000000001']);
        throw new Error('roll back');
      })
      .catch(() => undefined);

    const left = await context.db.selectFrom('pgboss.job' as never).selectAll().execute();
    expect(left).toEqual([]);
  });
});
