import request from 'supertest';
import { API } from '@shared/api/routes';
import type { ReviewDetail, ReviewRow } from '@shared/api/review';
import type { Page } from '@shared/api/paging';
import { createChartForm, createPerson, createScanRow, createStation, TEST_WEEKLY_FORM, type TestPerson } from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';
import { syntheticDraft, syntheticPressureHpa } from '../helpers/trace';

const CHART_START = '2026-03-02T00:00:00.000Z';

describe('review of handed-in ink lines', () => {
  let context: TestContext;
  let volunteer: TestPerson;
  let otherVolunteer: TestPerson;
  let archivist: TestPerson;
  let otherArchivist: TestPerson;
  let climatologist: TestPerson;
  let stationId: string;
  let chartFormId: string;
  let scanId: string;

  const as = (person: TestPerson, call: request.Test) => call.set('Authorization', `Bearer ${person.token}`);
  const handIn = (person: TestPerson, body: object, id = scanId) => as(person, request(context.app).post(API.scanInkLines(id))).send(body);
  const approve = (person: TestPerson, inkLineId: string, version: number) => as(person, request(context.app).post(API.inkLineApprove(inkLineId))).send({ version });
  const giveBack = (person: TestPerson, inkLineId: string, version: number, note?: string) =>
    as(person, request(context.app).post(API.inkLineReturn(inkLineId))).send(note === undefined ? { version } : { version, note });
  const rework = (person: TestPerson, inkLineId: string, version: number) => as(person, request(context.app).post(API.inkLineRework(inkLineId))).send({ version });
  const series = () => as(climatologist, request(context.app).get(API.series)).query({ stationId, from: '2026-03-02', to: '2026-03-09' });
  const csvRows = async () => {
    const response = await as(climatologist, request(context.app).get(API.seriesCsv)).query({ stationId, from: '2026-03-02', to: '2026-03-09' }).buffer(true);
    return response.text.trimEnd().split('\n').slice(1);
  };
  const scanStatus = async (id = scanId) => (await context.db.selectFrom('scan').select('status').where('id', '=', id).executeTakeFirstOrThrow()).status;
  const seriesChanges = () => context.db.selectFrom('series_change').select(['ink_line_id', 'change', 'reason']).orderBy('id').execute();

  beforeAll(async () => {
    context = await createTestContext();
  });

  beforeEach(async () => {
    await truncateTables(context.db);
    [volunteer, otherVolunteer, archivist, otherArchivist, climatologist] = await Promise.all([
      createPerson(context.db, ['volunteer']),
      createPerson(context.db, ['volunteer']),
      createPerson(context.db, ['archivist']),
      createPerson(context.db, ['archivist']),
      createPerson(context.db, ['climatologist']),
    ]);
    stationId = (await createStation(context.db)).id;
    chartFormId = (await createChartForm(context.db)).id;
    scanId = await createScanRow(context.db, { stationId, chartFormId, uploadedBy: archivist.id, chartStart: CHART_START });
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when a line is handed in, then the series and CSV stay empty until an archivist approves it, and approval is recorded', async () => {
    const handedIn = await handIn(volunteer, syntheticDraft(TEST_WEEKLY_FORM, CHART_START, 2, 26));

    const before = await series();
    const csvBefore = await csvRows();
    const approved = await approve(archivist, handedIn.body.inkLineId, handedIn.body.version);
    const after = await series();

    expect(handedIn.status).toBe(201);
    expect(before.body.points).toEqual([]);
    expect(csvBefore).toEqual([]);
    expect(approved.status).toBe(200);
    expect(approved.body).toMatchObject({ inkLineId: handedIn.body.inkLineId, status: 'approved', version: 2, scanStatus: 'approved' });
    expect(after.body.points).toHaveLength(25);
    expect(await csvRows()).toHaveLength(25);
    expect(await seriesChanges()).toEqual([{ ink_line_id: handedIn.body.inkLineId, change: 'added', reason: 'approved' }]);
    const audit = (await as(archivist, request(context.app).get(API.scanChangeLog(scanId)))).body.items;
    // Hand-in (traced), the decision and the scan's approval; the last two share their transaction's time.
    expect(audit.map((entry: { action: string }) => entry.action).sort()).toEqual(['review', 'status', 'status']);
    const review = audit.find((entry: { action: string }) => entry.action === 'review');
    expect(review.changes.inkLineStatus).toEqual({ before: 'handed_in', after: 'approved' });
  });

  it('when a line is only handed in, or approved on a scan later withdrawn, then neither the query API nor its CSV or NetCDF hold it', async () => {
    const handedIn = await handIn(volunteer, syntheticDraft(TEST_WEEKLY_FORM, CHART_START, 2, 26));
    const exports = async () => {
      const range = { stationId, from: '2026-03-02', to: '2026-03-09' };
      const json = await as(climatologist, request(context.app).get(API.seriesQuery)).query(range);
      const csv = await as(climatologist, request(context.app).get(API.seriesQuery)).query({ ...range, format: 'csv' }).buffer(true);
      const netcdf = await as(climatologist, request(context.app).get(API.seriesQuery)).query({ ...range, format: 'netcdf' }).buffer(true);
      const csvDataRows = csv.text.trimEnd().split('\n').filter((line) => line !== '' && !line.startsWith('#')).slice(1);
      return { jsonPoints: json.body.stations[0].points.length, csvDataRows: csvDataRows.length, netcdfStatus: netcdf.status };
    };

    const whileHandedIn = await exports();
    await approve(archivist, handedIn.body.inkLineId, handedIn.body.version).expect(200);
    const whileApproved = await exports();
    await as(archivist, request(context.app).post(API.scanStatus(scanId))).send({ status: 'withdrawn', reason: 'scanned twice' }).expect(200);
    const whileWithdrawn = await exports();

    expect(whileHandedIn).toEqual({ jsonPoints: 0, csvDataRows: 0, netcdfStatus: 404 });
    expect(whileApproved).toEqual({ jsonPoints: 25, csvDataRows: 25, netcdfStatus: 200 });
    expect(whileWithdrawn).toEqual({ jsonPoints: 0, csvDataRows: 0, netcdfStatus: 404 });
  });

  it('when a line is returned without a note, then it answers 400 naming note and nothing changes', async () => {
    const handedIn = await handIn(volunteer, syntheticDraft(TEST_WEEKLY_FORM, CHART_START));

    const response = await giveBack(archivist, handedIn.body.inkLineId, 1, '  ');

    expect(response.status).toBe(400);
    expect(Object.keys(response.body.error.details)).toEqual(['note']);
    const line = await context.db.selectFrom('ink_line').select(['status', 'version']).executeTakeFirstOrThrow();
    expect(line).toEqual({ status: 'handed_in', version: 1 });
  });

  it('when a line goes handed in → returned → draft → handed in → approved, then each move is allowed once and every other move has its own code', async () => {
    const first = await handIn(volunteer, syntheticDraft(TEST_WEEKLY_FORM, CHART_START, 2, 26));
    const id = first.body.inkLineId as string;

    const reworkTooEarly = await rework(volunteer, id, 1);
    const returned = await giveBack(archivist, id, 1, 'Pin 3 is on the 1010 line, not 1000; the knots after Tuesday noon stray off the pen line.');
    const approveReturned = await approve(archivist, id, 2);
    const handInWithoutRework = await handIn(volunteer, syntheticDraft(TEST_WEEKLY_FORM, CHART_START, 2, 26));
    const reworkByOther = await rework(otherVolunteer, id, 2);
    const desk = await as(volunteer, request(context.app).get(API.deskLines)).query({ section: 'returned' });
    const reworked = await rework(volunteer, id, 2);
    const approveDraft = await approve(archivist, id, 3);
    // The Bench hands in the reworked draft at the version it last saved (the rework made it 3).
    const again = await handIn(volunteer, { ...syntheticDraft(TEST_WEEKLY_FORM, CHART_START, 2, 30), draftVersion: 3 });
    const approved = await approve(archivist, id, again.body.version);

    expect(reworkTooEarly.body.error.code).toBe('ink_line_not_returned');
    expect(returned.status).toBe(200);
    expect(returned.body).toMatchObject({ status: 'returned', version: 2, scanStatus: 'ready_to_trace' });
    expect(approveReturned.status).toBe(409);
    expect(approveReturned.body.error.code).toBe('ink_line_not_handed_in');
    expect(handInWithoutRework.status).toBe(409);
    expect(handInWithoutRework.body.error.code).toBe('rework_returned_line_first');
    expect(reworkByOther.status).toBe(403);
    expect(reworkByOther.body.error.code).toBe('not_ink_line_author');
    expect(desk.body.items).toEqual([expect.objectContaining({ inkLineId: id, status: 'returned', returnNote: expect.stringMatching(/^Pin 3 is on the 1010 line/) })]);
    expect(reworked.body).toMatchObject({ inkLineId: id, status: 'draft', version: 3 });
    expect(approveDraft.body.error.code).toBe('ink_line_not_handed_in');
    // The hand-in after a rework is the same row, with its new knots and points.
    expect(again.status).toBe(201);
    expect(again.body).toMatchObject({ inkLineId: id, status: 'handed_in', version: 4, seriesPointCount: 29 });
    expect(approved.body).toMatchObject({ status: 'approved', scanStatus: 'approved' });
    expect(await context.db.selectFrom('ink_line').select('id').execute()).toEqual([{ id }]);
    expect((await series()).body.points).toHaveLength(29);
    const history = (await as(archivist, request(context.app).get(API.inkLineReview(id)))).body as ReviewDetail;
    expect(history.history.map((entry) => entry.decision)).toEqual(['approved', 'returned']);
    // Every decision is in the scan's change log, the return with its note.
    const log = (await as(archivist, request(context.app).get(API.scanChangeLog(scanId)))).body.items as { action: string; changes: Record<string, { after: unknown }> }[];
    const decisions = log.filter((entry) => entry.action === 'review').map((entry) => [entry.changes['inkLineStatus'].after, entry.changes['note']?.after ?? null]);
    expect(decisions).toHaveLength(2);
    expect(decisions).toEqual(expect.arrayContaining([['approved', null], ['returned', expect.stringMatching(/^Pin 3 is on the 1010 line/)]]));
  });

  it('when a reworked line is handed in again, then the change log keeps its earlier hand-in beside the new one (issue 13 finding 7)', async () => {
    const first = await handIn(volunteer, syntheticDraft(TEST_WEEKLY_FORM, CHART_START, 2, 26));
    const id = first.body.inkLineId as string;
    await giveBack(archivist, id, 1, 'The knots after Tuesday noon stray off the pen line.');
    await rework(volunteer, id, 2);
    const before = await context.db.selectFrom('ink_line').select(['pin_set_id', 'handed_in_at']).where('id', '=', id).executeTakeFirstOrThrow();

    const again = await handIn(volunteer, { ...syntheticDraft(TEST_WEEKLY_FORM, CHART_START, 2, 30), draftVersion: 3 });
    const log = await as(archivist, request(context.app).get(API.inkLineChangeLog(id)));
    const byVolunteer = await as(volunteer, request(context.app).get(API.inkLineChangeLog(id)));

    expect(again.status).toBe(201);
    expect(log.status).toBe(200);
    expect(log.body.total).toBe(1);
    const [entry] = log.body.items;
    expect(entry).toMatchObject({ action: 'hand_in_again', personName: `Test Person ${volunteer.email.split('@')[0]}` });
    expect(entry.changes.pinSetId.before).toBe(before.pin_set_id);
    expect(entry.changes.pinSetId.after).not.toBe(before.pin_set_id);
    expect(entry.changes.handedInAt.before).toBe((before.handed_in_at as Date).toISOString());
    expect(entry.changes.seriesPointCount).toEqual({ before: first.body.seriesPointCount, after: again.body.seriesPointCount });
    expect(byVolunteer.status).toBe(403);
  });

  it('when two archivists decide on the same line at once, then one wins and the other gets version_conflict', async () => {
    const handedIn = await handIn(volunteer, syntheticDraft(TEST_WEEKLY_FORM, CHART_START));

    const [first, second] = await Promise.all([
      approve(archivist, handedIn.body.inkLineId, 1),
      giveBack(otherArchivist, handedIn.body.inkLineId, 1, 'The pins are a day out.'),
    ]);

    const statuses = [first.status, second.status].sort();
    expect(statuses).toEqual([200, 409]);
    const loser = first.status === 409 ? first : second;
    expect(loser.body.error.code).toBe('version_conflict');
    expect(loser.body.error.details).toEqual({ currentVersion: 2 });
    const reviews = await context.db.selectFrom('ink_line_review').select('decision').execute();
    expect(reviews).toHaveLength(1);
  });

  it('when an approved line is returned, or its scan withdrawn and restored, then the series loses and regains it and each change is recorded', async () => {
    const handedIn = await handIn(volunteer, syntheticDraft(TEST_WEEKLY_FORM, CHART_START, 2, 26));
    const id = handedIn.body.inkLineId as string;
    await approve(archivist, id, 1).expect(200);
    const setStatus = (body: object) => as(archivist, request(context.app).post(API.scanStatus(scanId))).send(body);

    await setStatus({ status: 'withdrawn', reason: 'a second copy of the same week' }).expect(200);
    const whileWithdrawn = await series();
    const csvWhileWithdrawn = await csvRows();
    const decideWhileWithdrawn = await giveBack(archivist, id, 2, 'fix');
    const restored = await setStatus({ status: 'received' });
    const afterRestore = await series();
    const returned = await giveBack(archivist, id, 2, 'The last day follows the wrong pen line.');
    const afterReturn = await series();

    expect(whileWithdrawn.body.points).toEqual([]);
    expect(csvWhileWithdrawn).toEqual([]);
    expect(decideWhileWithdrawn.body.error.code).toBe('scan_withdrawn');
    // A restored scan comes back to what its ink lines say, not to received.
    expect(restored.body.status).toBe('approved');
    expect(afterRestore.body.points).toHaveLength(25);
    expect(returned.status).toBe(200);
    expect(afterReturn.body.points).toEqual([]);
    expect(await scanStatus()).toBe('ready_to_trace');
    expect(await seriesChanges()).toEqual([
      { ink_line_id: id, change: 'added', reason: 'approved' },
      { ink_line_id: id, change: 'removed', reason: 'scan withdrawn: a second copy of the same week' },
      { ink_line_id: id, change: 'added', reason: 'scan restored' },
      { ink_line_id: id, change: 'removed', reason: 'returned: The last day follows the wrong pen line.' },
    ]);
  });

  it('when an archivist sets a traced scan approved by hand, then it answers 409 scan_status_follows_ink_lines', async () => {
    await handIn(volunteer, syntheticDraft(TEST_WEEKLY_FORM, CHART_START)).expect(201);

    const response = await as(archivist, request(context.app).post(API.scanStatus(scanId))).send({ status: 'approved' });

    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe('scan_status_follows_ink_lines');
    expect(await scanStatus()).toBe('traced');
  });

  it('when the review list is asked for, then it pages handed-in lines oldest first with their figures, filtered by station, period and volunteer', async () => {
    const otherScan = await createScanRow(context.db, { stationId, chartFormId, uploadedBy: archivist.id, chartStart: '2026-03-09T00:00:00Z' });
    const early = syntheticDraft(TEST_WEEKLY_FORM, CHART_START, 2, 10);
    const late = syntheticDraft(TEST_WEEKLY_FORM, CHART_START, 20, 24);
    const first = await handIn(volunteer, { pins: early.pins, knots: [...early.knots, ...late.knots] });
    const second = await handIn(otherVolunteer, syntheticDraft(TEST_WEEKLY_FORM, '2026-03-09T00:00:00Z'), otherScan);

    const all = await as(archivist, request(context.app).get(API.review)).query({ pageSize: 1 });
    const byVolunteer = await as(archivist, request(context.app).get(API.review)).query({ authorId: otherVolunteer.id });
    const approvedOnes = await as(archivist, request(context.app).get(API.review)).query({ state: 'approved' });
    const byPeriod = await as(archivist, request(context.app).get(API.review)).query({ from: '2026-03-09', to: '2026-03-09' });
    const byStation = await as(archivist, request(context.app).get(API.review)).query({ stationId });
    const otherStation = await as(archivist, request(context.app).get(API.review)).query({ stationId: (await createStation(context.db)).id });
    const badFilter = await as(archivist, request(context.app).get(API.review)).query({ state: 'lost', from: 'soon' });

    const page = all.body as Page<ReviewRow>;
    expect(page.total).toBe(2);
    expect(page.items).toHaveLength(1);
    expect(page.items[0]).toMatchObject({
      inkLineId: first.body.inkLineId,
      status: 'handed_in',
      authorId: volunteer.id,
      spanFrom: '2026-03-02T02:00:00.000Z',
      spanTo: '2026-03-03T00:00:00.000Z',
      pointCount: 14,
      gapCount: 1,
      suspectShare: 0,
      agreement: null,
    });
    expect(page.items[0].pinRmsHpa).toBeLessThan(0.01);
    expect(byVolunteer.body.items.map((row: ReviewRow) => row.inkLineId)).toEqual([second.body.inkLineId]);
    expect(approvedOnes.body.total).toBe(0);
    expect(byPeriod.body.items.map((row: ReviewRow) => row.inkLineId)).toEqual([second.body.inkLineId]);
    expect(byStation.body.total).toBe(2);
    expect(otherStation.body.total).toBe(0);
    expect(badFilter.status).toBe(400);
    expect(Object.keys(badFilter.body.error.details).sort()).toEqual(['from', 'state']);
  });
  it('when one line was handed in with chart on and check readings and another without, then each row says which corrections it applied and the review page has their residuals', async () => {
    const hoursIso = (hours: number) => new Date(Date.parse(CHART_START) + hours * 3_600_000).toISOString();
    const otherScan = await createScanRow(context.db, { stationId, chartFormId, uploadedBy: archivist.id, chartStart: '2026-03-09T00:00:00Z' });
    // Chart on written half an hour after the line's first knot: the clock ran 30 min slow. The barometer read
    // 1.5 hPa below the line at the corrected times: the pen reads high (as in proof-checklist.spec.ts).
    const corrected = {
      ...syntheticDraft(TEST_WEEKLY_FORM, CHART_START, 2, 26),
      chartOn: hoursIso(2.5),
      checkReadings: [8, 20].map((hours) => ({ time: hoursIso(hours), pressureHpa: syntheticPressureHpa(hours - 0.5) - 1.5 })),
    };
    const first = await handIn(volunteer, corrected);
    const second = await handIn(otherVolunteer, syntheticDraft(TEST_WEEKLY_FORM, '2026-03-09T00:00:00Z'), otherScan);

    const list = await as(archivist, request(context.app).get(API.review));
    const detail = await as(archivist, request(context.app).get(API.inkLineReview(first.body.inkLineId)));
    const plain = await as(archivist, request(context.app).get(API.inkLineReview(second.body.inkLineId)));

    expect(first.status).toBe(201);
    const rows = new Map((list.body as Page<ReviewRow>).items.map((row) => [row.inkLineId, row.corrections]));
    expect(rows.get(first.body.inkLineId)).toEqual({ clockMarkCount: 1, instrumentReadingCount: 2 });
    expect(rows.get(second.body.inkLineId)).toEqual({ clockMarkCount: 0, instrumentReadingCount: 0 });
    const { corrections, chartForm, registration } = detail.body as ReviewDetail;
    expect(corrections.clock).toMatchObject({ method: 'offset', marks: [expect.objectContaining({ kind: 'chart_on', trueTime: hoursIso(2.5), isDropped: false })] });
    expect(corrections.clock!.firstOffsetMinutes).toBeCloseTo(30, 0);
    expect(corrections.instrument).toMatchObject({ method: 'drift', readings: [expect.objectContaining({ time: hoursIso(8) }), expect.objectContaining({ time: hoursIso(20) })] });
    expect(corrections.instrument!.meanOffsetHpa).toBeCloseTo(-1.5, 1);
    expect(corrections.checkReadingUses).toEqual(['used', 'used']);
    expect(chartForm).toMatchObject({ drumHours: TEST_WEEKLY_FORM.drumHours, pressureMin: TEST_WEEKLY_FORM.pressureMin });
    expect(registration.paperToPixel).toHaveLength(9);
    expect((plain.body as ReviewDetail).corrections).toEqual({ clock: null, instrument: null, checkReadingUses: [] });
  });
});

describe('hand-in checks on the server', () => {
  let context: TestContext;
  let volunteer: TestPerson;
  let scanId: string;

  const handIn = (body: object) => request(context.app).post(API.scanInkLines(scanId)).set('Authorization', `Bearer ${volunteer.token}`).send(body);

  beforeAll(async () => {
    context = await createTestContext();
  });

  beforeEach(async () => {
    await truncateTables(context.db);
    volunteer = await createPerson(context.db, ['volunteer']);
    const archivist = await createPerson(context.db, ['archivist']);
    const stationId = (await createStation(context.db)).id;
    const chartFormId = (await createChartForm(context.db)).id;
    scanId = await createScanRow(context.db, { stationId, chartFormId, uploadedBy: archivist.id, chartStart: CHART_START });
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  async function expectNothingStored(): Promise<void> {
    expect(await context.db.selectFrom('ink_line').select('id').execute()).toEqual([]);
    expect(await context.db.selectFrom('pin_set').select('id').execute()).toEqual([]);
    expect((await context.db.selectFrom('scan').select('status').executeTakeFirstOrThrow()).status).toBe('ready_to_trace');
  }

  it('when a pin lies outside the image, then it answers 422 pin_outside_image naming the pin and stores nothing', async () => {
    const draft = syntheticDraft(TEST_WEEKLY_FORM, CHART_START);
    const pins = draft.pins.map((pin, i) => (i === 2 ? { ...pin, xPx: 1650 } : pin));

    const response = await handIn({ pins, knots: draft.knots });

    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('pin_outside_image');
    expect(response.body.error.details).toEqual({ pins: [2] });
    await expectNothingStored();
  });

  it('when knots lie outside the image, then it answers 422 knot_outside_image naming them', async () => {
    const draft = syntheticDraft(TEST_WEEKLY_FORM, CHART_START);
    const knots = [...draft.knots, { xPx: 1200, yPx: -5 }, { xPx: 1300, yPx: 900 }];

    const response = await handIn({ pins: draft.pins, knots });

    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('knot_outside_image');
    expect(response.body.error.details).toEqual({ knots: [draft.knots.length, draft.knots.length + 1], count: 2 });
    await expectNothingStored();
  });

  it('when knots run back in time, then it answers 422 knots_out_of_time_order naming the first knot out of order', async () => {
    const draft = syntheticDraft(TEST_WEEKLY_FORM, CHART_START, 2, 26);
    const knots = [...draft.knots.slice(0, 10), ...draft.knots.slice(0, 5)];

    const response = await handIn({ pins: draft.pins, knots });

    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('knots_out_of_time_order');
    expect(response.body.error.details.knots[0]).toBe(10);
    await expectNothingStored();
  });

  it('when knots read beyond the drum period, then it answers 422 span_outside_drum_period', async () => {
    // A 26-hour daily drum drawn at the weekly form's scale: knots from hour 2 to 40 fall past its end.
    const daily = await createChartForm(context.db, { drumHours: 26 });
    await context.db.updateTable('scan').set({ chart_form_id: daily.id }).where('id', '=', scanId).execute();
    const draft = syntheticDraft(TEST_WEEKLY_FORM, CHART_START, 2, 40);

    const response = await handIn(draft);

    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('span_outside_drum_period');
    // Weekly grid of 2 h: 26 h + one grid step = 28 h is the last time inside; the 72 knots every 10 minutes after
    // it are out, and the knot at 28 h itself reads within rounding of the limit, so it may count as well.
    expect(response.body.error.details.count).toBeGreaterThanOrEqual((40 - 28) * 6);
    expect(response.body.error.details.count).toBeLessThanOrEqual((40 - 28) * 6 + 1);
    await expectNothingStored();
  });

  it('when one pin is typed 3 hPa off, then the pin RMS is over the form limit and it answers 422 pin_rms_over_limit naming that pin', async () => {
    const draft = syntheticDraft(TEST_WEEKLY_FORM, CHART_START);
    const pins = draft.pins.map((pin, i) => (i === 4 ? { ...pin, pressure: pin.pressure + 3 } : pin));

    const response = await handIn({ pins, knots: draft.knots });

    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('pin_rms_over_limit');
    // The weekly test form has a 1 hPa grid and 2 h arcs: limits 0.5 hPa and 60 min (half a grid step each).
    expect(response.body.error.details).toMatchObject({ limitHpa: 0.5, limitMinutes: 60 });
    expect(response.body.error.details.pins).toContain(4);
    await expectNothingStored();
  });
});
