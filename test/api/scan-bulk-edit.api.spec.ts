import request from 'supertest';
import { API } from '@shared/api/routes';
import type { ScanBulkEditResult, ScanChangeLogEntry } from '@shared/api/scans';
import { createChartForm, createPerson, createScanRow, createStation, type TestPerson } from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

jest.setTimeout(60_000);

describe('bulk cataloguing: POST /api/scans/bulk-edit', () => {
  let context: TestContext;
  let archivist: TestPerson;
  let stationId: string;
  let chartFormId: string;
  let scanIds: string[];

  const bulkEdit = (body: unknown) => request(context.app).post(API.scanBulkEdit).set('Authorization', `Bearer ${archivist.token}`).send(body as object);
  const readScan = (id: string) =>
    context.db.selectFrom('scan').select(['station_id', 'chart_form_id', 'chart_start', 'box', 'tags', 'version']).where('id', '=', id).executeTakeFirstOrThrow();

  beforeAll(async () => {
    context = await createTestContext();
  });

  beforeEach(async () => {
    await truncateTables(context.db);
    archivist = await createPerson(context.db, ['archivist']);
    stationId = (await createStation(context.db)).id;
    chartFormId = (await createChartForm(context.db)).id;
    scanIds = [];
    for (const name of ['KRO_1931-03-02.tif', 'KRO_1931-03-09.tif', 'KRO_1931-03-16.tif']) {
      scanIds.push(await createScanRow(context.db, { stationId: null, chartFormId: null, chartStart: null, uploadedBy: archivist.id, status: 'received', originalName: name, tags: ['gale'] }));
    }
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when three scans get a station, form, box, a tag and each its chart start, then all change in one go and each gets one change-log entry', async () => {
    const starts = ['1931-03-02T08:00:00.000Z', '1931-03-09T08:00:00.000Z', '1931-03-16T08:00:00.000Z'];

    const response = await bulkEdit({
      scans: scanIds.map((id, i) => ({ id, version: 1, chartStart: starts[i] })),
      set: { stationId, chartFormId, box: 'B14', addTags: ['Storm'] },
    });

    expect(response.status).toBe(200);
    const result = response.body as ScanBulkEditResult;
    expect(result.items.map((scan) => scan.id)).toEqual(scanIds);
    for (const [i, id] of scanIds.entries()) {
      const row = await readScan(id);
      expect(row).toMatchObject({ station_id: stationId, chart_form_id: chartFormId, box: 'B14', tags: ['gale', 'storm'], version: 2 });
      expect(row.chart_start?.toISOString()).toBe(starts[i]);
      const log = (await request(context.app).get(API.scanChangeLog(id)).set('Authorization', `Bearer ${archivist.token}`)).body.items as ScanChangeLogEntry[];
      expect(log).toHaveLength(1);
      expect(log[0].changes['chartStart']).toEqual({ before: null, after: starts[i] });
      expect(log[0].changes['tags']).toEqual({ before: ['gale'], after: ['gale', 'storm'] });
    }
  });

  it('when one scan was changed by someone else since it was read, then 409 names that scan and none of the scans change', async () => {
    await context.db.updateTable('scan').set({ version: 5 }).where('id', '=', scanIds[2]).execute();

    const response = await bulkEdit({ scans: scanIds.map((id) => ({ id, version: 1 })), set: { stationId } });

    expect(response.status).toBe(409);
    expect(response.body.error).toMatchObject({ code: 'version_conflict', details: { scanId: scanIds[2], currentVersion: 5 } });
    for (const id of scanIds) expect((await readScan(id)).station_id).toBeNull();
    expect(await context.db.selectFrom('scan_audit').selectAll().execute()).toHaveLength(0);
  });

  it('when the body is malformed, then 400 names each bad field', async () => {
    const response = await bulkEdit({ scans: [{ id: 'not-an-id', version: 0 }, { id: scanIds[0], version: 1, chartStart: '2 March 1931' }], set: { stationId: 'x' } });

    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(Object.keys(response.body.error.details).sort()).toEqual(['scans[0].id', 'scans[0].version', 'scans[1].chartStart', 'set.stationId']);
  });

  it('when nothing would change, or no scan is listed, then 400 says so', async () => {
    const empty = await bulkEdit({ scans: [{ id: scanIds[0], version: 1 }], set: {} });
    const none = await bulkEdit({ scans: [], set: { box: 'B1' } });

    expect(empty.status).toBe(400);
    expect(empty.body.error.details).toEqual({ set: 'nothing to change: set a field or give chart starts' });
    expect(none.status).toBe(400);
    expect(Object.keys(none.body.error.details)).toEqual(['scans']);
  });
});
