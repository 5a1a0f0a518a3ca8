import request from 'supertest';
import { API } from '@shared/api/routes';
import type { ScanChangeLogEntry, ScanDetail, ScanStatusCounts, ScanSummary } from '@shared/api/scans';
import { createChartForm, createPerson, createScanRow, createStation, type TestPerson } from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

describe('scan catalogue: filters, counts, metadata, status and audit', () => {
  let context: TestContext;
  let archivist: TestPerson;
  let volunteer: TestPerson;

  const asArchivist = (call: request.Test) => call.set('Authorization', `Bearer ${archivist.token}`);
  const list = async (query: Record<string, unknown>) => {
    const response = await request(context.app).get(API.scans).query(query).set('Authorization', `Bearer ${volunteer.token}`);
    expect(response.status).toBe(200);
    return (response.body.items as ScanSummary[]).map((scan) => scan.originalName).sort();
  };

  beforeAll(async () => {
    context = await createTestContext();
  });

  beforeEach(async () => {
    await truncateTables(context.db);
    archivist = await createPerson(context.db, ['archivist']);
    volunteer = await createPerson(context.db, ['volunteer']);
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  describe('filters', () => {
    let stationA: string;
    let stationB: string;
    let weekly: string;
    let daily: string;
    let instrumentId: string;
    let batchId: string;

    beforeEach(async () => {
      stationA = (await createStation(context.db)).id;
      stationB = (await createStation(context.db)).id;
      weekly = (await createChartForm(context.db, { drumHours: 168 })).id;
      daily = (await createChartForm(context.db, { drumHours: 26, mmPerHour: 8 })).id;
      instrumentId = (await request(context.app).post(API.stationInstruments(stationA)).set('Authorization', `Bearer ${archivist.token}`).send({ serial: 'B-1' })).body.id;
      batchId = (await asArchivist(request(context.app).post(API.intakeBatches)).send({ label: 'filters' })).body.id;
      const base = { uploadedBy: archivist.id };
      // weekly-a: 2 to 9 March 1931 from its chart start and the form's 168 h drum.
      await createScanRow(context.db, { ...base, stationId: stationA, chartFormId: weekly, chartStart: '1931-03-02T08:00Z', originalName: 'weekly-a.png', instrumentId, tags: ['gale', 'faint ink'], batchId });
      // daily-b: 10 March, 26 h.
      await createScanRow(context.db, { ...base, stationId: stationA, chartFormId: daily, chartStart: '1931-03-10T08:00Z', originalName: 'daily-b.png', tags: ['gale'], status: 'traced' });
      // written-c: no chart start, only the chart on/off times as written: 20 to 27 March.
      await createScanRow(context.db, { ...base, stationId: stationB, chartFormId: null, chartStart: null, chartOn: '1931-03-20T09:00Z', chartOff: '1931-03-27T09:00Z', originalName: 'written-c.png', status: 'received', observer: 'Ada Quillfeather' });
      // bare-d: nothing known yet.
      await createScanRow(context.db, { ...base, stationId: null, chartFormId: null, chartStart: null, originalName: 'bare-d.png', status: 'received', transcription: 'Clock stopped Tuesday, wound at noon' });
    });

    it.each([
      ['stationId A', () => ({ stationId: stationA }), ['daily-b.png', 'weekly-a.png']],
      ['status received', () => ({ status: 'received' }), ['bare-d.png', 'written-c.png']],
      ['instrumentId', () => ({ instrumentId }), ['weekly-a.png']],
      ['chartFormId daily', () => ({ chartFormId: daily }), ['daily-b.png']],
      ['batchId', () => ({ batchId }), ['weekly-a.png']],
      ['one tag', () => ({ tag: 'gale' }), ['daily-b.png', 'weekly-a.png']],
      ['two tags (both required)', () => ({ tag: ['gale', 'faint ink'] }), ['weekly-a.png']],
      ['free text in a transcription', () => ({ q: 'clock wound' }), ['bare-d.png']],
      ['free text in an observer name', () => ({ q: 'quillfeather' }), ['written-c.png']],
      ['free text in a file name', () => ({ q: 'weekly' }), ['weekly-a.png']],
      // Spans: weekly-a 2–9 Mar (chart start + 168 h), daily-b 10–11 Mar (chart start + 26 h), written-c 20–27 Mar (as written).
      ['a range inside weekly-a', () => ({ from: '1931-03-05T00:00Z', to: '1931-03-06T00:00Z' }), ['weekly-a.png']],
      ['a range touching the end of weekly-a and daily-b', () => ({ from: '1931-03-09T00:00Z', to: '1931-03-10T12:00Z' }), ['daily-b.png', 'weekly-a.png']],
      ['a range over written-c by its chart on/off', () => ({ from: '1931-03-25', to: '1931-03-26' }), ['written-c.png']],
      ['only from', () => ({ from: '1931-03-11T00:00Z' }), ['daily-b.png', 'written-c.png']],
      ['a range after everything', () => ({ from: '1931-04-01', to: '1931-04-30' }), []],
    ])('when the catalogue is filtered by %s, then only the matching scans come back', async (_name, query, expected) => {
      const names = await list(query());

      expect(names).toEqual(expected);
    });

    it('when status counts are asked for with a station filter, then every status is counted under it', async () => {
      const response = await request(context.app).get(API.scanStatusCounts).query({ stationId: stationA, status: 'traced' }).set('Authorization', `Bearer ${archivist.token}`);

      expect(response.status).toBe(200);
      // The status filter is left out of the counts: they are the dashboard's per-status totals.
      expect(response.body).toEqual<ScanStatusCounts>({ received: 0, ready_to_trace: 1, traced: 1, approved: 0, withdrawn: 0 });
    });

    it('when the catalogue is sorted by chart start, then scans without a chart start come last', async () => {
      const response = await request(context.app).get(API.scans).query({ sort: 'chartStart', direction: 'desc' }).set('Authorization', `Bearer ${volunteer.token}`);

      expect(response.body.items.map((scan: ScanSummary) => scan.originalName).slice(0, 2)).toEqual(['daily-b.png', 'weekly-a.png']);
      expect(response.body.total).toBe(4);
    });

    it('when a filter is malformed, then it answers 400 naming it', async () => {
      const response = await request(context.app).get(API.scans).query({ from: 'March', instrumentId: 'x', to: '1931-01-01' }).set('Authorization', `Bearer ${volunteer.token}`);

      expect(response.status).toBe(400);
      expect(Object.keys(response.body.error.details).sort()).toEqual(['from', 'instrumentId']);
    });
  });

  describe('metadata, status and change log', () => {
    let stationId: string;
    let chartFormId: string;
    let scanId: string;

    beforeEach(async () => {
      stationId = (await createStation(context.db)).id;
      chartFormId = (await createChartForm(context.db)).id;
      scanId = await createScanRow(context.db, { stationId: null, chartFormId: null, chartStart: null, uploadedBy: archivist.id, status: 'received' });
    });

    const patch = (body: Record<string, unknown>) => asArchivist(request(context.app).patch(API.scan(scanId))).send(body);
    const setStatus = (body: Record<string, unknown>) => asArchivist(request(context.app).post(API.scanStatus(scanId))).send(body);

    it('when the metadata is edited at its version, then the detail shows it and one audit row records before and after', async () => {
      const response = await patch({ version: 1, stationId, chartFormId, chartStart: '1931-03-02T08:00+01:00', observer: 'A. Q.', tags: ['Gale', 'gale', ' storm '], box: '14', dpi: 300 });

      expect(response.status).toBe(200);
      expect(response.body).toMatchObject<Partial<ScanDetail>>({ stationId, chartFormId, chartStart: '1931-03-02T07:00:00.000Z', observer: 'A. Q.', tags: ['gale', 'storm'], box: '14', dpi: 300, version: 2 });
      const audit = await asArchivist(request(context.app).get(API.scanChangeLog(scanId)));
      expect(audit.body.total).toBe(1);
      const [entry] = audit.body.items as ScanChangeLogEntry[];
      expect(entry).toMatchObject({ action: 'edit', personName: expect.stringContaining('Test Person') });
      expect(entry.changes).toEqual({
        stationId: { before: null, after: stationId },
        chartFormId: { before: null, after: chartFormId },
        chartStart: { before: null, after: '1931-03-02T07:00:00.000Z' },
        observer: { before: '', after: 'A. Q.' },
        tags: { before: [], after: ['gale', 'storm'] },
        box: { before: '', after: '14' },
        dpi: { before: null, after: 300 },
      });
      const station = await context.db.selectFrom('station').select('name').where('id', '=', stationId).executeTakeFirstOrThrow();
      const form = await context.db.selectFrom('chart_form').select('name').where('id', '=', chartFormId).executeTakeFirstOrThrow();
      expect(entry.names).toEqual({ [stationId]: station.name, [chartFormId]: form.name });
    });

    it('when two archivists edit from the same version, then the second gets 409 version_conflict and no audit row', async () => {
      await patch({ version: 1, observer: 'first' });

      const second = await patch({ version: 1, observer: 'second' });

      expect(second.status).toBe(409);
      expect(second.body.error).toMatchObject({ code: 'version_conflict', details: { currentVersion: 2 } });
      const rows = await context.db.selectFrom('scan_audit').selectAll().where('scan_id', '=', scanId).execute();
      expect(rows).toHaveLength(1);
      const scan = await context.db.selectFrom('scan').select('observer').where('id', '=', scanId).executeTakeFirstOrThrow();
      expect(scan.observer).toBe('first');
    });

    it('when an instrument of another station is chosen, then it answers 400 naming instrumentId', async () => {
      const otherStation = (await createStation(context.db)).id;
      const instrument = (await asArchivist(request(context.app).post(API.stationInstruments(otherStation))).send({ serial: 'X-1' })).body.id;

      const response = await patch({ version: 1, stationId, instrumentId: instrument });

      expect(response.status).toBe(400);
      expect(Object.keys(response.body.error.details)).toEqual(['instrumentId']);
    });

    it('when a scan lacks station, form and chart start, then ready to trace is refused naming each', async () => {
      await context.db.updateTable('scan').set({ derivative_state: 'working' }).where('id', '=', scanId).execute();

      const response = await setStatus({ status: 'ready_to_trace' });

      expect(response.status).toBe(409);
      expect(response.body.error.code).toBe('scan_incomplete');
      expect(response.body.error.details).toEqual({ missing: ['stationId', 'chartFormId', 'chartStart', 'derivativeState'] });
      expect(response.body.error.message).toMatch(/a station, a chart form, a chart start/);
    });

    it('when a catalogued scan is made ready to trace, then the status changes and is audited', async () => {
      await patch({ version: 1, stationId, chartFormId, chartStart: '1931-03-02T08:00Z' });

      const response = await setStatus({ status: 'ready_to_trace' });

      expect(response.status).toBe(200);
      expect(response.body).toMatchObject({ status: 'ready_to_trace', version: 3 });
      const audit = (await asArchivist(request(context.app).get(API.scanChangeLog(scanId)))).body.items as ScanChangeLogEntry[];
      expect(audit.map((entry) => entry.action)).toEqual(['status', 'edit']);
      expect(audit[0].changes).toEqual({ status: { before: 'received', after: 'ready_to_trace' } });
    });

    it('when a scan is withdrawn without a reason, then it answers 400 naming reason', async () => {
      const response = await setStatus({ status: 'withdrawn' });

      expect(response.status).toBe(400);
      expect(Object.keys(response.body.error.details)).toEqual(['reason']);
    });

    it('when a scan is withdrawn with a reason and restored, then it is received again and the reason is cleared', async () => {
      const withdrawn = await setStatus({ status: 'withdrawn', reason: 'second copy of the 1931-03-02 chart, water damaged' });
      const restored = await setStatus({ status: 'received' });

      expect(withdrawn.body).toMatchObject({ status: 'withdrawn', withdrawnReason: 'second copy of the 1931-03-02 chart, water damaged' });
      expect(restored.body).toMatchObject({ status: 'received', withdrawnReason: null });
    });

    it('when a scan is moved to the status it has, then it answers 409 status_unchanged', async () => {
      const response = await setStatus({ status: 'received' });

      expect(response.status).toBe(409);
      expect(response.body.error.code).toBe('status_unchanged');
    });

    it('when a move is not allowed, then it answers 409 listing the allowed ones', async () => {
      const response = await setStatus({ status: 'approved' });

      expect(response.status).toBe(409);
      expect(response.body.error.code).toBe('status_move_not_allowed');
      expect(response.body.error.details).toEqual({ allowed: ['ready_to_trace', 'withdrawn'] });
    });

    it('when a traced scan\'s station is changed, then it answers 409 and nothing changes', async () => {
      const traced = await createScanRow(context.db, { stationId, chartFormId, chartStart: '1931-03-02T08:00Z', uploadedBy: archivist.id, status: 'traced' });
      const otherStation = (await createStation(context.db)).id;

      const response = await asArchivist(request(context.app).patch(API.scan(traced))).send({ version: 1, stationId: otherStation });

      expect(response.status).toBe(409);
      expect(response.body.error.code).toBe('scan_fields_locked');
      const row = await context.db.selectFrom('scan').select(['station_id', 'version']).where('id', '=', traced).executeTakeFirstOrThrow();
      expect(row).toEqual({ station_id: stationId, version: 1 });
    });

    it('when a ready-to-trace scan would lose its chart form, then it answers 409 naming it', async () => {
      const ready = await createScanRow(context.db, { stationId, chartFormId, chartStart: '1931-03-02T08:00Z', uploadedBy: archivist.id });

      const response = await asArchivist(request(context.app).patch(API.scan(ready))).send({ version: 1, chartFormId: null });

      expect(response.status).toBe(409);
      expect(response.body.error.code).toBe('scan_incomplete');
      expect(response.body.error.details).toEqual({ missing: ['chartFormId'] });
    });

    it('when a scan detail is read, then it carries every catalogue field', async () => {
      const response = await request(context.app).get(API.scan(scanId)).set('Authorization', `Bearer ${volunteer.token}`);

      expect(response.status).toBe(200);
      expect(Object.keys(response.body).sort()).toEqual(
        [
          'id', 'stationId', 'stationName', 'chartFormId', 'chartFormName', 'chartStart', 'status', 'originalName', 'mediaType', 'sizeBytes',
          'widthPx', 'heightPx', 'sha256', 'pageIndex', 'pageCount', 'uploadedAt', 'inkLineCount', 'derivativeState', 'chartOn', 'chartOff', 'tags',
          'instrumentId', 'instrumentSerial', 'batchId', 'observer', 'collection', 'box', 'folder', 'item', 'conditionNotes', 'notes', 'transcription',
          'withdrawnReason', 'dpi', 'orientation', 'derivativeError', 'derivativeAttempts', 'version',
        ].sort(),
      );
    });
  });
});
