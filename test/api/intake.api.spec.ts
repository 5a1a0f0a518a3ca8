import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import request from 'supertest';
import type { IntakeBatchDetail, IntakeFileResult, InventoryMatch } from '@shared/api/intake';
import { API, IIIF } from '@shared/api/routes';
import { createChartForm, createPerson, createStation, type TestPerson } from '../helpers/factories';
import { makeGifBytes, makeJpeg, makePng, makeTruncatedPng } from '../helpers/images';
import { makeBombPng, makeEmptyPdf, makeEncryptedPdf, makeJpegWithDpi, makeMultiPageTiff, makeScannedPdf } from '../helpers/scan-files';
import { listenOnLoopback, sendWholeFile } from '../helpers/raw-upload';
import { closeScanTableGate } from '../helpers/scan-table-gate';
import { clearStorage, createTestContext, listFiles, type TestContext, truncateTables } from '../helpers/test-app';

// PDF pages are read in a child process and derivatives are made in the background: seconds, not milliseconds.
jest.setTimeout(60_000);

describe('intake batches', () => {
  let context: TestContext;
  let archivist: TestPerson;
  let batchId: string;

  function sendFile(file: Buffer, fileName: string, fields: Record<string, string> = {}, id = batchId) {
    let call = request(context.app).post(API.intakeBatchFiles(id)).set('Authorization', `Bearer ${archivist.token}`);
    for (const [name, value] of Object.entries(fields)) call = call.field(name, value);
    return call.attach('file', file, fileName);
  }

  async function batchDetail(): Promise<IntakeBatchDetail> {
    return (await request(context.app).get(API.intakeBatch(batchId)).set('Authorization', `Bearer ${archivist.token}`)).body as IntakeBatchDetail;
  }

  async function scanCount(): Promise<number> {
    const { count } = await context.db.selectFrom('scan').select((eb) => eb.fn.countAll<number>().as('count')).executeTakeFirstOrThrow();
    return count;
  }

  beforeAll(async () => {
    context = await createTestContext();
  });

  beforeEach(async () => {
    await truncateTables(context.db);
    await clearStorage(context.storage);
    archivist = await createPerson(context.db, ['archivist']);
    const created = await request(context.app).post(API.intakeBatches).set('Authorization', `Bearer ${archivist.token}`).send({ label: 'Box 14, Kestrel Ridge 1931' });
    batchId = created.body.id;
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when a batch is created, then it is listed with its label, creator and empty counts', async () => {
    const response = await request(context.app).get(API.intakeBatches).set('Authorization', `Bearer ${archivist.token}`);

    expect(response.status).toBe(200);
    expect(response.body.total).toBe(1);
    expect(response.body.items[0]).toMatchObject({
      id: batchId,
      label: 'Box 14, Kestrel Ridge 1931',
      createdByName: expect.stringContaining('Test Person'),
      fileCount: 0,
      counts: { stored: 0, duplicate: 0, rejected: 0 },
      hasInventory: false,
    });
  });

  it('when a batch has no label, then it answers 400 naming label', async () => {
    const response = await request(context.app).post(API.intakeBatches).set('Authorization', `Bearer ${archivist.token}`).send({ label: '  ' });

    expect(response.status).toBe(400);
    expect(Object.keys(response.body.error.details)).toContain('label');
  });

  it('when a PNG arrives without metadata, then it is stored as received in the batch with a derivative job queued', async () => {
    const response = await sendFile(await makePng(90, 45), 'kro-1931-w10.png');

    expect(response.status).toBe(201);
    const result = response.body as IntakeFileResult;
    expect(result).toMatchObject({ fileName: 'kro-1931-w10.png', outcome: 'stored' });
    expect(result.scans).toHaveLength(1);
    expect(result.scans[0]).toMatchObject({ status: 'received', stationId: null, chartFormId: null, chartStart: null, derivativeState: 'queued', pageIndex: 0, pageCount: 1 });
    const row = await context.db.selectFrom('scan').selectAll().where('id', '=', result.scans[0].id).executeTakeFirstOrThrow();
    expect(row.batch_id).toBe(batchId);
    const jobs = await context.db.selectFrom('pgboss.job' as never).selectAll().execute();
    expect(jobs).toEqual([expect.objectContaining({ name: 'scan-derivatives', data: { scanId: row.id }, retry_limit: 3, retry_backoff: true })]);
  });

  it('when a one-page file carries station, chart form and chart start, then it keeps them and waits for its derivatives as received', async () => {
    const station = await createStation(context.db);
    const form = await createChartForm(context.db);

    const response = await sendFile(await makeJpeg(), 'week.jpg', { stationId: station.id, chartFormId: form.id, chartStart: '1931-03-02T08:00Z' });

    expect(response.status).toBe(201);
    // Ready to trace needs derivatives (scan-status.ts); the worker moves it (derivatives.api.spec.ts).
    expect(response.body.scans[0]).toMatchObject({ status: 'received', stationId: station.id, chartFormId: form.id, chartStart: '1931-03-02T08:00:00.000Z' });
  });

  it('when a three-page TIFF arrives, then each page becomes a scan sharing the master, with the dpi from the file', async () => {
    const tiff = await makeMultiPageTiff(3, 120, 60, 300);

    const response = await sendFile(tiff, 'folder-3.tif');

    expect(response.status).toBe(201);
    const scans = (response.body as IntakeFileResult).scans;
    expect(scans.map((scan) => [scan.pageIndex, scan.pageCount, scan.widthPx, scan.heightPx, scan.mediaType])).toEqual([
      [0, 3, 120, 60, 'image/tiff'],
      [1, 3, 120, 60, 'image/tiff'],
      [2, 3, 120, 60, 'image/tiff'],
    ]);
    expect(new Set(scans.map((scan) => scan.sha256)).size).toBe(1);
    const rows = await context.db.selectFrom('scan').select(['dpi', 'storage_key']).execute();
    expect(rows.map((row) => row.dpi)).toEqual([300, 300, 300]);
    expect(new Set(rows.map((row) => row.storage_key)).size).toBe(1);
    expect(await listFiles(path.join(context.storage.rootDir, 'masters'))).toHaveLength(1);
  });

  it('when a file is stored, then each of its scans has an upload audit row by the archivist', async () => {
    const response = await sendFile(await makeMultiPageTiff(2), 'pair.tif');

    const rows = await context.db.selectFrom('scan_audit').selectAll().execute();
    expect(rows.map((row) => [row.scan_id, row.person_id, row.action])).toEqual(
      expect.arrayContaining(response.body.scans.map((scan: { id: string }) => [scan.id, archivist.id, 'upload'])),
    );
    expect(rows).toHaveLength(2);
  });

  it('when derivatives are not made yet, then a PNG is rendered through IIIF on demand and a PDF page answers 409', async () => {
    const png = await sendFile(await makePng(200, 100), 'early.png');
    const pdf = await sendFile(await makeScannedPdf(1), 'early.pdf');

    const pngImage = await request(context.app).get(IIIF.image(png.body.scans[0].id, 'full', '100,')).set('Authorization', `Bearer ${archivist.token}`);
    const pdfImage = await request(context.app).get(IIIF.image(pdf.body.scans[0].id, 'full', 'max')).set('Authorization', `Bearer ${archivist.token}`);

    expect(pngImage.status).toBe(200);
    expect(pngImage.headers['content-type']).toBe('image/jpeg');
    expect(pdfImage.status).toBe(409);
    expect(pdfImage.body.error.code).toBe('derivatives_not_ready');
    expect(pdfImage.body.error.message).toMatch(/still being rendered/);
  });

  it('when a JPEG carries 400 dpi in its header, then the scan records 400 dpi', async () => {
    const response = await sendFile(await makeJpegWithDpi(80, 40, 400), 'dpi.jpg');

    expect(response.status).toBe(201);
    const row = await context.db.selectFrom('scan').select('dpi').executeTakeFirstOrThrow();
    expect(row.dpi).toBe(400);
  });

  it('when a two-page PDF arrives, then each page becomes a scan with the page image size and dpi', async () => {
    const pdf = await makeScannedPdf(2, 150, 75, 150);

    const response = await sendFile(pdf, 'ledger.pdf');

    expect(response.status).toBe(201);
    const scans = (response.body as IntakeFileResult).scans;
    expect(scans.map((scan) => [scan.pageIndex, scan.pageCount, scan.widthPx, scan.heightPx, scan.mediaType])).toEqual([
      [0, 2, 150, 75, 'application/pdf'],
      [1, 2, 150, 75, 'application/pdf'],
    ]);
    const rows = await context.db.selectFrom('scan').select('dpi').execute();
    expect(rows.map((row) => row.dpi)).toEqual([150, 150]);
  });

  it.each([
    ['bytes that are not an image, named .png', () => Buffer.from('box list, not a chart\n'.repeat(20)), 'not-a-chart.png', 415, 'unsupported_file_type'],
    ['a GIF', () => makeGifBytes(), 'chart.gif', 415, 'unsupported_file_type'],
    ['a PNG cut short', () => makeTruncatedPng(), 'cut.png', 422, 'corrupt_image'],
    ['a decompression bomb', () => makeBombPng(), 'bomb.png', 413, 'image_too_large'],
    ['an encrypted PDF', () => makeEncryptedPdf(), 'locked.pdf', 422, 'unreadable_pdf'],
    ['a PDF without pages', () => makeEmptyPdf(), 'empty.pdf', 422, 'unreadable_pdf'],
  ])('when %s arrives, then it is refused with a reason, recorded as rejected, and nothing is kept', async (_case, make, fileName, status, code) => {
    const response = await sendFile(await make(), fileName);

    expect(response.status).toBe(status);
    expect(response.body.error.code).toBe(code);
    expect(response.body.error.message.length).toBeGreaterThan(10);
    expect(await scanCount()).toBe(0);
    expect(await listFiles(context.storage.rootDir)).toEqual([]);
    const detail = await batchDetail();
    expect(detail.counts).toEqual({ stored: 0, duplicate: 0, rejected: 1 });
    expect(detail.files).toEqual([expect.objectContaining({ fileName, outcome: 'rejected', code, reason: response.body.error.message, scanIds: [] })]);
  });

  it('when a PDF is encrypted or empty, then the reason says which', async () => {
    const encrypted = await sendFile(await makeEncryptedPdf(), 'locked.pdf');
    const empty = await sendFile(makeEmptyPdf(), 'empty.pdf');

    expect(encrypted.body.error.message).toMatch(/encrypted/);
    expect(empty.body.error.message).toMatch(/no pages/);
  });

  it('when a file is sent again, then it answers 409 naming the existing scan and the batch counts a duplicate', async () => {
    const png = await makePng();
    const first = await sendFile(png, 'a.png');

    const second = await sendFile(png, 'a-again.png');

    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('duplicate_scan');
    expect(second.body.error.details.existingScanId).toBe(first.body.scans[0].id);
    const detail = await batchDetail();
    expect(detail.counts).toEqual({ stored: 1, duplicate: 1, rejected: 0 });
    expect(detail.files[1]).toMatchObject({ fileName: 'a-again.png', outcome: 'duplicate', scanIds: [first.body.scans[0].id] });
    expect(detail.scans.map((scan) => scan.id)).toEqual([first.body.scans[0].id]);
  });

  it('when the same file arrives twice at the same moment, then one is stored and the other is a duplicate', async () => {
    const tiff = await makeMultiPageTiff(2);

    const responses = await Promise.all([sendFile(tiff, 'twin-a.tif'), sendFile(tiff, 'twin-b.tif')]);

    expect(responses.map((response) => response.status).sort()).toEqual([201, 409]);
    expect(await scanCount()).toBe(2);
    expect(await listFiles(path.join(context.storage.rootDir, 'masters'))).toHaveLength(1);
    const stored = responses.find((response) => response.status === 201)!;
    const masterKey = await context.db.selectFrom('scan').select('storage_key').executeTakeFirstOrThrow();
    expect(await listFiles(path.join(context.storage.rootDir, 'masters'))).toEqual([masterKey.storage_key.replace('masters/', '')]);
    expect(stored.body.scans).toHaveLength(2);
  });

  it('when two copies both pass the hash lookup and one loses at the unique index, then the batch records it as a duplicate of the winner', async () => {
    const tiff = await makeMultiPageTiff(2);
    const gate = await closeScanTableGate(context.config.databaseUrl, 'inserts');
    const sending = Promise.all([sendFile(tiff, 'twin-a.tif'), sendFile(tiff, 'twin-b.tif')].map((call) => call.then((response) => response)));
    await gate.waitForWaiting(2);

    await gate.open();
    const responses = await sending;

    const stored = responses.find((response) => response.status === 201)!;
    const refused = responses.find((response) => response.status === 409)!;
    const winnerIds = stored.body.scans.map((scan: { id: string }) => scan.id);
    expect(refused.body.error.details.existingScanId).toBe(winnerIds[0]);
    const detail = await batchDetail();
    expect(detail.counts).toEqual({ stored: 1, duplicate: 1, rejected: 0 });
    expect(detail.fileCount).toBe(2);
    const loserName = stored.body.fileName === 'twin-a.tif' ? 'twin-b.tif' : 'twin-a.tif';
    expect(detail.files).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ fileName: stored.body.fileName, outcome: 'stored', scanIds: winnerIds }),
        expect.objectContaining({ fileName: loserName, outcome: 'duplicate', code: 'duplicate_scan', reason: refused.body.error.message, scanIds: winnerIds }),
      ]),
    );
  });

  describe('when the client hangs up before the answer', () => {
    let listening: { port: number; close(): Promise<void> };

    /** File records of the batch once there are `count` (the server finishes on its own after the client has gone). */
    async function fileRecordsOnceThere(count: number, timeoutMs = 10_000) {
      const deadline = Date.now() + timeoutMs;
      let files = (await batchDetail()).files;
      while (files.length < count && Date.now() < deadline) {
        await new Promise((resolve) => setTimeout(resolve, 50));
        files = (await batchDetail()).files;
      }
      return files;
    }

    beforeEach(async () => {
      listening = await listenOnLoopback(context.app);
    });

    afterEach(async () => {
      await listening.close();
    });

    it('when two copies meet at the unique index and both clients have gone, then the batch still records one stored and one duplicate', async () => {
      const tiff = await makeMultiPageTiff(2);
      const gate = await closeScanTableGate(context.config.databaseUrl, 'inserts');
      const uploads = [await sendWholeFile(listening.port, API.intakeBatchFiles(batchId), archivist.token, tiff, 'twin-a.tif'), await sendWholeFile(listening.port, API.intakeBatchFiles(batchId), archivist.token, tiff, 'twin-b.tif')];
      await gate.waitForWaiting(2);
      for (const upload of uploads) upload.hangUp();

      await gate.open();
      const files = await fileRecordsOnceThere(2);

      const scanIds = (await context.db.selectFrom('scan').select('id').orderBy('page_index').execute()).map((row) => row.id);
      expect(scanIds).toHaveLength(2);
      expect(files.map((file) => file.outcome).sort()).toEqual(['duplicate', 'stored']);
      expect(files.find((file) => file.outcome === 'duplicate')).toMatchObject({ code: 'duplicate_scan', scanIds });
      expect((await batchDetail()).counts).toEqual({ stored: 1, duplicate: 1, rejected: 0 });
    });

    it('when a copy is refused at the hash lookup after its client has gone, then the batch still records it as a duplicate', async () => {
      const png = await makePng();
      const first = await sendFile(png, 'kro-1931-w10.png');
      const gate = await closeScanTableGate(context.config.databaseUrl, 'reads');
      const copy = await sendWholeFile(listening.port, API.intakeBatchFiles(batchId), archivist.token, png, 'kro-1931-w10-copy.png');
      await gate.waitForWaiting(1);
      copy.hangUp();

      await gate.open();
      const files = await fileRecordsOnceThere(2);

      expect(files[1]).toMatchObject({ fileName: 'kro-1931-w10-copy.png', outcome: 'duplicate', code: 'duplicate_scan', scanIds: [first.body.scans[0].id] });
      expect(await scanCount()).toBe(1);
    });

    it('when a file is refused as damaged after its client has gone, then the batch still records it as rejected', async () => {
      const gate = await closeScanTableGate(context.config.databaseUrl, 'reads');
      const cut = await sendWholeFile(listening.port, API.intakeBatchFiles(batchId), archivist.token, await makeTruncatedPng(), 'cut.png');
      await gate.waitForWaiting(1);
      cut.hangUp();

      await gate.open();
      const files = await fileRecordsOnceThere(1);

      expect(files).toEqual([expect.objectContaining({ fileName: 'cut.png', outcome: 'rejected', code: 'corrupt_image', scanIds: [] })]);
      expect(await scanCount()).toBe(0);
    });
  });

  it('when the batch does not exist, then the file is refused with 404 before it streams in', async () => {
    const response = await sendFile(await makePng(), 'lost.png', {}, '00000000-0000-4000-8000-000000000000');

    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('intake_batch_not_found');
    expect(await listFiles(context.storage.rootDir)).toEqual([]);
  });

  it('when the client breaks the upload off half-way, then no file and no row are left', async () => {
    const server = context.app.listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    const { port } = server.address() as AddressInfo;
    const boundary = 'isallo-test-boundary';
    const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="half.png"\r\nContent-Type: image/png\r\n\r\n`);
    const png = await makePng(400, 300);

    await new Promise<void>((resolve) => {
      const req = http.request({
        host: '127.0.0.1',
        port,
        method: 'POST',
        path: API.intakeBatchFiles(batchId),
        headers: { Authorization: `Bearer ${archivist.token}`, 'Content-Type': `multipart/form-data; boundary=${boundary}`, 'Content-Length': String(head.length + png.length * 4) },
      });
      req.on('error', () => resolve());
      req.write(head);
      req.write(png.subarray(0, Math.floor(png.length / 2)), () => setTimeout(() => {
        req.destroy();
        resolve();
      }, 100));
    });
    // The server notices the broken connection on its own schedule; look until the temp file is gone.
    const deadline = Date.now() + 5000;
    while ((await listFiles(context.storage.rootDir)).length > 0 && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 50));
    await new Promise((resolve) => server.close(resolve));

    expect(await listFiles(context.storage.rootDir)).toEqual([]);
    expect(await scanCount()).toBe(0);
    expect((await batchDetail()).files).toEqual([]);
  });

  describe('inventory', () => {
    /** The bytes storeFiles sent, by file name (to send a copy). */
    const sentBytes: Record<string, Buffer> = {};

    async function storeFiles(): Promise<Record<string, string[]>> {
      const ids: Record<string, string[]> = {};
      for (const [fileName, file] of [
        ['KRO-1931-w10.png', await makePng()],
        ['kro-1931-w11.jpg', await makeJpeg()],
        ['unlisted.png', await makePng()],
      ] as const) {
        const response = await sendFile(file, fileName);
        ids[fileName] = response.body.scans.map((scan: { id: string }) => scan.id);
        sentBytes[fileName] = file;
      }
      return ids;
    }

    function sendInventory(csv: string) {
      return request(context.app).post(API.intakeBatchInventory(batchId)).set('Authorization', `Bearer ${archivist.token}`).set('Content-Type', 'text/csv').send(csv);
    }

    it('when an inventory is imported, then matched rows fill the scans, and unmatched rows and files are listed', async () => {
      const station = await createStation(context.db, { code: 'KRO', name: 'Kestrel Ridge', timeZone: 'Europe/London', timeStandard: 'local_standard' });
      const ids = await storeFiles();
      const csv = [
        'File name,Station,Chart on,Chart off,Box,Folder,Notes',
        'kro-1931-w10.png,KRO,1931-03-02 08:00,1931-03-09 08:10,14,3,"ink faint, Tuesday"',
        'kro-1931-w11,Kestrel Ridge,1931-07-06 08:00,,14,4,',
        'kro-1931-w12.png,KRO,1931-03-16 08:00,,14,5,missing from the box',
      ].join('\r\n');

      const response = await sendInventory(csv);

      expect(response.status).toBe(200);
      const match = response.body as InventoryMatch;
      expect(match.matched).toEqual([
        { line: 2, fileName: 'kro-1931-w10.png', scanIds: ids['KRO-1931-w10.png'] },
        { line: 3, fileName: 'kro-1931-w11', scanIds: ids['kro-1931-w11.jpg'] },
      ]);
      expect(match.rowsWithoutFile).toEqual([{ line: 4, fileName: 'kro-1931-w12.png' }]);
      expect(match.filesWithoutRow).toEqual([{ fileName: 'unlisted.png', scanIds: ids['unlisted.png'] }]);
      const first = await context.db.selectFrom('scan').selectAll().where('id', '=', ids['KRO-1931-w10.png'][0]).executeTakeFirstOrThrow();
      expect(first).toMatchObject({ station_id: station.id, box: '14', folder: '3', notes: 'ink faint, Tuesday', version: 2 });
      // Europe/London standard time is GMT (UTC+0) all year; in July the chart still reads GMT, not BST (common practice; zone offsets from the IANA tz database, from memory).
      expect(first.chart_on?.toISOString()).toBe('1931-03-02T08:00:00.000Z');
      expect(first.chart_off?.toISOString()).toBe('1931-03-09T08:10:00.000Z');
      const second = await context.db.selectFrom('scan').selectAll().where('id', '=', ids['kro-1931-w11.jpg'][0]).executeTakeFirstOrThrow();
      expect(second.chart_on?.toISOString()).toBe('1931-07-06T08:00:00.000Z');
      const audit = await context.db.selectFrom('scan_audit').selectAll().where('scan_id', '=', first.id).where('action', '=', 'inventory').executeTakeFirstOrThrow();
      expect(audit.person_id).toBe(archivist.id);
      expect(audit.changes).toMatchObject({ stationId: { before: null, after: station.id }, box: { before: '', after: '14' } });
      expect((await batchDetail()).hasInventory).toBe(true);
    });

    it('when rows name files refused as duplicates, then they are matched to the scans holding the bytes with a note, and fill nothing', async () => {
      await createStation(context.db, { code: 'KRO' });
      const ids = await storeFiles();
      const earlierBatch = await request(context.app).post(API.intakeBatches).set('Authorization', `Bearer ${archivist.token}`).send({ label: 'Box 9, Kestrel Ridge 1930' });
      const tiff = await makeMultiPageTiff(2);
      const earlier = await sendFile(tiff, 'kro-1930-ledger.tif', {}, earlierBatch.body.id);
      const earlierIds = earlier.body.scans.map((scan: { id: string }) => scan.id);
      expect((await sendFile(sentBytes['KRO-1931-w10.png'], 'kro-1931-w10-copy.png')).status).toBe(409);
      expect((await sendFile(tiff, 'ledger-rescan.tif')).status).toBe(409);
      const csv = [
        'file name,station,chart on,box,folder',
        'KRO-1931-w10.png,KRO,1931-03-02 08:00,14,3',
        'kro-1931-w10-copy.png,KRO,1931-03-09 08:00,14,4',
        'ledger-rescan,KRO,1930-01-06 08:00,14,5',
      ].join('\n');

      const response = await sendInventory(csv);

      expect(response.status).toBe(200);
      const match = response.body as InventoryMatch;
      expect(match.rowsWithoutFile).toEqual([]);
      expect(match.matched).toEqual([
        { line: 2, fileName: 'KRO-1931-w10.png', scanIds: ids['KRO-1931-w10.png'] },
        { line: 3, fileName: 'kro-1931-w10-copy.png', scanIds: ids['KRO-1931-w10.png'], duplicateOf: ids['KRO-1931-w10.png'][0], note: expect.stringContaining('this batch') },
        { line: 4, fileName: 'ledger-rescan', scanIds: earlierIds, duplicateOf: earlierIds[0], note: expect.stringContaining('Box 9, Kestrel Ridge 1930') },
      ]);
      expect(match.matched[1].note).toMatch(/duplicate of scan .*KRO-1931-w10\.png.*applied to no scan/);
      const stored = await context.db.selectFrom('scan').selectAll().where('id', '=', ids['KRO-1931-w10.png'][0]).executeTakeFirstOrThrow();
      expect(stored).toMatchObject({ folder: '3', version: 2 });
      expect(stored.chart_on?.toISOString()).toBe('1931-03-02T08:00:00.000Z');
      const untouched = await context.db.selectFrom('scan').select(['folder', 'version']).where('id', 'in', earlierIds).execute();
      expect(untouched).toEqual([{ folder: '', version: 1 }, { folder: '', version: 1 }]);
      const audits = await context.db.selectFrom('scan_audit').select('scan_id').where('action', '=', 'inventory').execute();
      expect(audits.map((row) => row.scan_id)).toEqual([ids['KRO-1931-w10.png'][0]]);
    });

    it('when two rows name the same duplicate file, then the second is a row without a file', async () => {
      const ids = await storeFiles();
      await sendFile(sentBytes['KRO-1931-w10.png'], 'copy.png');

      const response = await sendInventory('file name\ncopy.png\ncopy.png\n');

      expect(response.body.matched).toEqual([expect.objectContaining({ line: 2, scanIds: ids['KRO-1931-w10.png'], duplicateOf: ids['KRO-1931-w10.png'][0] })]);
      expect(response.body.rowsWithoutFile).toEqual([{ line: 3, fileName: 'copy.png' }]);
    });

    it('when a row has a bad date, then it answers 400 naming the line and column and changes nothing', async () => {
      await createStation(context.db, { code: 'KRO' });
      await storeFiles();
      const csv = 'file name,station,chart on\nkro-1931-w10.png,KRO,1931-03-02 08:00\nkro-1931-w11.jpg,KRO,second of March\n';

      const response = await sendInventory(csv);

      expect(response.status).toBe(400);
      expect(response.body.error.details).toEqual({ 'line 3, chart on': expect.stringContaining('second of March') });
      expect(response.body.error.message).toContain('line 3, chart on');
      const changed = await context.db.selectFrom('scan').select('id').where('version', '>', 1).execute();
      expect(changed).toEqual([]);
      expect((await batchDetail()).hasInventory).toBe(false);
    });

    it('when a row names an unknown station, then it answers 400 naming the line and the station column', async () => {
      await storeFiles();

      const response = await sendInventory('file name,station\nkro-1931-w10.png,Nowhere Fell\n');

      expect(response.status).toBe(400);
      expect(response.body.error.details).toEqual({ 'line 2, station': 'no station has the code or name "Nowhere Fell"' });
    });

    it('when the header has no file name column, then it answers 400 naming line 1', async () => {
      const response = await sendInventory('name,station\nkro-1931-w10.png,KRO\n');

      expect(response.status).toBe(400);
      expect(Object.keys(response.body.error.details)).toEqual(['line 1, file name']);
    });
  });
});
