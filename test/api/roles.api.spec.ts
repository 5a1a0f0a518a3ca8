import { EMPTY_BENCH_WORK } from '@shared/api/bench-work';
import fs from 'node:fs/promises';
import request from 'supertest';
import type { Role } from '@shared/api/roles';
import { ROLES } from '@shared/api/roles';
import { API, IIIF } from '@shared/api/routes';
import * as instrumentsRepository from '../../server/instruments/instruments.repository';
import * as intakeRepository from '../../server/intake/intake.repository';
import * as invitationsRepository from '../../server/people/invitations.repository';
import * as scansService from '../../server/scans/scans.service';
import { createChartForm, createInkLineWithPoints, createPerson, createScanRow, createStation, TEST_PASSWORD, TEST_WEEKLY_FORM, type TestPerson } from '../helpers/factories';
import { makePng } from '../helpers/images';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';
import { createTracedFrontScan } from '../helpers/lesson-fixtures';
import { readStoredState, storedChanges } from '../helpers/stored-state';
import { syntheticDraft } from '../helpers/trace';

// The fixtures of every route are made once in beforeAll; on a shared, busy machine that takes longer than 5 s.
jest.setTimeout(60_000);

const PERIOD_START = '2026-03-02T00:00:00.000Z';

// The set-up uploads a scan and traces a front; the password routes hash with argon2id: slow on a loaded machine.
jest.setTimeout(30_000);

interface RouteCase {
  name: string;
  roles: readonly Role[];
  successStatus: number;
  call(token: string | null): Promise<request.Response>;
  /** Rows a successful call adds; a refused call must leave this unchanged. */
  sideEffectCount?: () => Promise<number>;
}

describe('who may call each route', () => {
  let context: TestContext;
  const people = {} as Record<Role, TestPerson>;
  let stationId: string;
  let chartFormId: string;
  let scanId: string;
  let seriesScanId: string;
  let draftScanId: string;
  let instrumentId: string;
  let editableFormId: string;
  let batchId: string;
  let statusScanId: string;
  let failedScanId: string;
  let formNumber = 0;
  let lessonId: string;
  let lessonShareId: string;
  let lessonToken: string;
  let editedPersonId: string;
  let invitationId: string;
  let inviteNumber = 0;

  /** A new person with the roles of the token's owner, or null for no token. */
  async function throwawayToken(token: string | null): Promise<string | null> {
    if (token === null) return null;
    const owner = Object.values(people).find((person) => person.token === token) as TestPerson;
    return (await createPerson(context.db, owner.roles)).token;
  }

  /** A line of a scan of its own, by the volunteer, for a route that moves it (each call gets a fresh one). */
  async function freshInkLine(status: 'handed_in' | 'returned'): Promise<string> {
    const lineScanId = await createScanRow(context.db, { stationId, chartFormId, uploadedBy: people.archivist.id, chartStart: PERIOD_START, status: 'traced' });
    return createInkLineWithPoints(context.db, { scanId: lineScanId, stationId, authorId: people.volunteer.id, status, points: [] });
  }

  function withToken(call: request.Test, token: string | null): request.Test {
    return token === null ? call : call.set('Authorization', `Bearer ${token}`);
  }

  async function versionOf(table: 'station' | 'instrument' | 'chart_form' | 'scan' | 'lesson' | 'person', id: string): Promise<number> {
    const row = await context.db.selectFrom(table).select('version').where('id', '=', id).executeTakeFirstOrThrow();
    return row.version;
  }

  async function count(
    table: 'scan' | 'ink_line' | 'station' | 'instrument' | 'chart_form' | 'intake_batch' | 'lesson' | 'lesson_share' | 'invitation' | 'people_change' | 'api_token',
  ): Promise<number> {
    const { total } = await context.db.selectFrom(table).select((eb) => eb.fn.countAll<number>().as('total')).executeTakeFirstOrThrow();
    return total;
  }

  const routes: RouteCase[] = [
    { name: 'GET /api/auth/me', roles: ROLES, successStatus: 200, call: (token) => withToken(request(context.app).get(API.me), token) },
    { name: 'GET /api/stations', roles: ROLES, successStatus: 200, call: (token) => withToken(request(context.app).get(API.stations), token) },
    {
      name: 'GET /api/chart-forms',
      roles: ROLES,
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.chartForms), token),
    },
    { name: 'GET /api/stations/:stationId', roles: ROLES, successStatus: 200, call: (token) => withToken(request(context.app).get(API.station(stationId)), token) },
    {
      name: 'POST /api/stations',
      roles: ['archivist'],
      successStatus: 201,
      call: (token) => withToken(request(context.app).post(API.stations), token).send({ code: 'NEW1', name: 'New Station', timeZone: 'UTC' }),
      sideEffectCount: () => count('station'),
    },
    {
      name: 'PATCH /api/stations/:stationId',
      roles: ['archivist'],
      successStatus: 200,
      call: async (token) => withToken(request(context.app).patch(API.station(stationId)), token).send({ version: await versionOf('station', stationId), historyNotes: 'edited' }),
    },
    {
      name: 'GET /api/stations/:stationId/instruments',
      roles: ROLES,
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.stationInstruments(stationId)), token),
    },
    {
      name: 'POST /api/stations/:stationId/instruments',
      roles: ['archivist'],
      successStatus: 201,
      call: (token) => withToken(request(context.app).post(API.stationInstruments(stationId)), token).send({ serial: 'R-1' }),
      sideEffectCount: () => count('instrument'),
    },
    { name: 'GET /api/instruments/:instrumentId', roles: ROLES, successStatus: 200, call: (token) => withToken(request(context.app).get(API.instrument(instrumentId)), token) },
    {
      name: 'PATCH /api/instruments/:instrumentId',
      roles: ['archivist'],
      successStatus: 200,
      call: async (token) => withToken(request(context.app).patch(API.instrument(instrumentId)), token).send({ version: await versionOf('instrument', instrumentId), notes: 'edited' }),
    },
    { name: 'GET /api/chart-forms/:chartFormId', roles: ROLES, successStatus: 200, call: (token) => withToken(request(context.app).get(API.chartForm(chartFormId)), token) },
    {
      name: 'POST /api/chart-forms',
      roles: ['archivist'],
      successStatus: 201,
      call: (token) => withToken(request(context.app).post(API.chartForms), token).send({ ...TEST_WEEKLY_FORM, name: `Role form ${++formNumber}` }),
      sideEffectCount: () => count('chart_form'),
    },
    {
      name: 'PATCH /api/chart-forms/:chartFormId',
      roles: ['archivist'],
      successStatus: 200,
      call: async (token) => withToken(request(context.app).patch(API.chartForm(editableFormId)), token).send({ version: await versionOf('chart_form', editableFormId), gridHoursStep: 1 }),
    },
    {
      name: 'POST /api/intake/batches',
      roles: ['archivist'],
      successStatus: 201,
      call: (token) => withToken(request(context.app).post(API.intakeBatches), token).send({ label: 'role batch' }),
      sideEffectCount: () => count('intake_batch'),
    },
    { name: 'GET /api/intake/batches', roles: ['archivist'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.intakeBatches), token) },
    { name: 'GET /api/intake/batches/:batchId', roles: ['archivist'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.intakeBatch(batchId)), token) },
    {
      name: 'POST /api/intake/batches/:batchId/files',
      roles: ['archivist'],
      successStatus: 201,
      call: async (token) => withToken(request(context.app).post(API.intakeBatchFiles(batchId)), token).attach('file', await makePng(), 'intake.png'),
      sideEffectCount: () => count('scan'),
    },
    {
      name: 'POST /api/intake/batches/:batchId/inventory',
      roles: ['archivist'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).post(API.intakeBatchInventory(batchId)), token).set('Content-Type', 'text/csv').send('file name,box\nintake.png,7\n'),
    },
    { name: 'GET /api/scans/status-counts', roles: ['archivist'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.scanStatusCounts), token) },
    {
      name: 'PATCH /api/scans/:scanId',
      roles: ['archivist'],
      successStatus: 200,
      call: async (token) => withToken(request(context.app).patch(API.scan(scanId)), token).send({ version: await versionOf('scan', scanId), conditionNotes: 'torn corner' }),
    },
    {
      name: 'POST /api/scans/bulk-edit',
      roles: ['archivist'],
      successStatus: 200,
      call: async (token) =>
        withToken(request(context.app).post(API.scanBulkEdit), token).send({ scans: [{ id: scanId, version: await versionOf('scan', scanId) }], set: { addTags: ['roles'] } }),
    },
    {
      name: 'POST /api/scans/:scanId/status',
      roles: ['archivist'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).post(API.scanStatus(statusScanId)), token).send({ status: 'withdrawn', reason: 'duplicate chart' }),
    },
    { name: 'GET /api/scans/:scanId/change-log', roles: ['archivist'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.scanChangeLog(scanId)), token) },
    {
      name: 'POST /api/scans/:scanId/derivatives/retry',
      roles: ['archivist'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).post(API.scanDerivativesRetry(failedScanId)), token),
    },
    {
      name: 'GET /iiif/3/:scanId',
      // A climatologist reads the images of scans with an approved line (seriesScanId has one, see beforeAll).
      roles: ['archivist', 'volunteer', 'climatologist'],
      successStatus: 303,
      call: (token) => withToken(request(context.app).get(IIIF.imageBase(seriesScanId)).redirects(0), token),
    },
    {
      name: 'GET /iiif/3/:scanId/info.json',
      // A climatologist reads the images of scans with an approved line (seriesScanId has one, see beforeAll).
      roles: ['archivist', 'volunteer', 'climatologist'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(IIIF.info(seriesScanId)), token),
    },
    {
      name: 'GET /iiif/3/:scanId/:region/:size/:rotation/:quality.:format',
      // A climatologist reads the images of scans with an approved line (seriesScanId has one, see beforeAll).
      roles: ['archivist', 'volunteer', 'climatologist'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(IIIF.image(seriesScanId, 'full', '!100,100')), token),
    },
    {
      name: 'GET /iiif/3/:scanId/manifest',
      roles: ['archivist', 'volunteer'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(IIIF.manifest(scanId)), token),
    },
    {
      name: 'GET /iiif/collection/box/:collection/:box',
      roles: ['archivist', 'volunteer'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(IIIF.boxCollection('ROLE', '1')), token),
    },
    {
      name: 'GET /api/scans',
      roles: ['archivist', 'volunteer'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.scans), token),
    },
    {
      name: 'POST /api/scans',
      roles: ['archivist'],
      successStatus: 201,
      call: async (token) =>
        withToken(request(context.app).post(API.scans), token)
          .field('stationId', stationId)
          .field('chartFormId', chartFormId)
          .field('chartStart', PERIOD_START)
          .attach('file', await makePng(), 'chart.png'),
      sideEffectCount: () => count('scan'),
    },
    {
      name: 'GET /api/scans/:scanId',
      roles: ['archivist', 'volunteer'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.scan(scanId)), token),
    },
    {
      name: 'GET /api/scans/:scanId/preview',
      roles: ['archivist', 'volunteer'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.scanPreview(scanId)), token),
    },
    {
      name: 'POST /api/scans/:scanId/ink-lines',
      roles: ['volunteer'],
      successStatus: 201,
      call: (token) => withToken(request(context.app).post(API.scanInkLines(scanId)), token).send(syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START, 2, 8)),
      sideEffectCount: () => count('ink_line'),
    },
    {
      name: 'PUT /api/scans/:scanId/ink-lines/draft',
      roles: ['volunteer'],
      successStatus: 201,
      call: (token) => withToken(request(context.app).put(API.scanDraft(draftScanId)), token).send({ version: null, work: EMPTY_BENCH_WORK }),
      sideEffectCount: () => count('ink_line'),
    },
    {
      name: 'GET /api/scans/:scanId/ink-lines/mine',
      roles: ['volunteer'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.scanMyInkLine(scanId)), token),
    },
    { name: 'GET /api/ink-lines/mine', roles: ['volunteer'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.myInkLines), token) },
    {
      name: 'POST /api/scans/:scanId/follow-ink',
      roles: ['volunteer'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).post(API.scanFollowInk(scanId)), token).send({ pins: syntheticDraft(TEST_WEEKLY_FORM, PERIOD_START, 2, 8).pins }),
    },
    {
      name: 'GET /api/series',
      roles: ['climatologist', 'teacher'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.series).query({ stationId, from: '2026-03-01', to: '2026-03-08' }), token),
    },
    {
      name: 'GET /api/series/query',
      roles: ['climatologist', 'teacher'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.seriesQuery).query({ stationId, from: '2026-03-01', to: '2026-03-08', step: 'daily' }), token),
    },
    {
      name: 'GET /api/stations/:stationId/coverage',
      roles: ['climatologist', 'teacher'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.stationCoverage(stationId)), token),
    },
    { name: 'GET /api/tokens', roles: ['climatologist'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.apiTokens), token) },
    {
      name: 'POST /api/tokens',
      roles: ['climatologist'],
      successStatus: 201,
      call: (token) => withToken(request(context.app).post(API.apiTokens), token).send({ name: 'roles test' }),
      sideEffectCount: () => count('api_token'),
    },
    {
      name: 'DELETE /api/tokens/:tokenId',
      roles: ['climatologist'],
      // Nobody holds this token, so a climatologist gets past the role check to its 404.
      successStatus: 404,
      call: (token) => withToken(request(context.app).delete(API.apiToken('00000000-0000-4000-8000-000000000000')), token),
    },
    {
      name: 'GET /api/series.csv',
      roles: ['climatologist', 'teacher'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.seriesCsv).query({ stationId, from: '2026-03-01', to: '2026-03-08' }), token),
    },
    {
      name: 'GET /api/stations/:stationId/change-log',
      roles: ['archivist', 'admin'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.stationChangeLog(stationId)), token),
    },
    {
      name: 'GET /api/instruments/:instrumentId/change-log',
      roles: ['archivist', 'admin'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.instrumentChangeLog(instrumentId)), token),
    },
    {
      name: 'GET /api/chart-forms/:chartFormId/change-log',
      roles: ['archivist', 'admin'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.chartFormChangeLog(chartFormId)), token),
    },
    {
      name: 'GET /api/ink-lines/:inkLineId/change-log',
      roles: ['archivist', 'admin'],
      successStatus: 200,
      call: async (token) => withToken(request(context.app).get(API.inkLineChangeLog(await freshInkLine('handed_in'))), token),
    },
    { name: 'GET /api/review', roles: ['archivist'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.review), token) },
    {
      name: 'GET /api/ink-lines/:inkLineId/review',
      roles: ['archivist'],
      successStatus: 200,
      call: async (token) => withToken(request(context.app).get(API.inkLineReview(await freshInkLine('handed_in'))), token),
    },
    {
      name: 'POST /api/ink-lines/:inkLineId/approve',
      roles: ['archivist'],
      successStatus: 200,
      call: async (token) => withToken(request(context.app).post(API.inkLineApprove(await freshInkLine('handed_in'))), token).send({ version: 1 }),
    },
    {
      name: 'POST /api/ink-lines/:inkLineId/return',
      roles: ['archivist'],
      successStatus: 200,
      call: async (token) => withToken(request(context.app).post(API.inkLineReturn(await freshInkLine('handed_in'))), token).send({ version: 1, note: 'Pins are a day out.' }),
    },
    {
      name: 'POST /api/ink-lines/:inkLineId/rework',
      roles: ['volunteer'],
      successStatus: 200,
      call: async (token) => withToken(request(context.app).post(API.inkLineRework(await freshInkLine('returned'))), token).send({ version: 1 }),
    },
    { name: 'GET /api/desk/summary', roles: ['volunteer'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.deskSummary), token) },
    {
      name: 'GET /api/desk/lines',
      roles: ['volunteer'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.deskLines).query({ section: 'returned' }), token),
    },
    { name: 'POST /api/desk/next', roles: ['volunteer'], successStatus: 200, call: (token) => withToken(request(context.app).post(API.deskNext), token) },
    {
      name: 'DELETE /api/desk/claims/:scanId',
      roles: ['volunteer'],
      successStatus: 204,
      call: async (token) => {
        const claimed = await createScanRow(context.db, { stationId, chartFormId, uploadedBy: people.archivist.id, chartStart: PERIOD_START });
        await context.db.insertInto('chart_claim').values({ scan_id: claimed, person_id: people.volunteer.id, expires_at: new Date(Date.now() + 3_600_000) }).execute();
        return withToken(request(context.app).delete(API.deskClaim(claimed)), token);
      },
    },
    {
      name: 'GET /api/tracing/progress',
      roles: ['archivist'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.tracingProgress).query({ groupBy: 'box' }), token),
    },
    { name: 'GET /api/tracing/priorities', roles: ['archivist'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.tracingPriorities), token) },
    {
      name: 'PUT /api/tracing/priorities',
      roles: ['archivist'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).put(API.tracingPriorities), token).send({ scope: 'box', collection: 'ROLE', box: '1', priority: 5 }),
    },
    { name: 'GET /api/tracing/stations/:stationId', roles: ['archivist'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.stationTracing(stationId)), token) },
    {
      name: 'PUT /api/tracing/stations/:stationId',
      roles: ['archivist'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).put(API.stationTracing(stationId)), token).send({ inkLinesRequired: 1 }),
    },
    { name: 'GET /api/people', roles: ['admin'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.people), token) },
    { name: 'GET /api/people/changes', roles: ['admin'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.peopleChanges), token) },
    {
      name: 'PATCH /api/people/:personId',
      roles: ['admin'],
      successStatus: 200,
      call: async (token) => {
        // Each call flips the target between two roles, so each allowed call is a change (and a log entry).
        const current = await context.db.selectFrom('person_role').select('role').where('person_id', '=', editedPersonId).execute();
        const roles = current.some((row) => row.role === 'teacher') ? ['volunteer'] : ['teacher'];
        return withToken(request(context.app).patch(API.person(editedPersonId)), token).send({ version: await versionOf('person', editedPersonId), roles });
      },
      sideEffectCount: () => count('people_change'),
    },
    { name: 'GET /api/invitations', roles: ['admin'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.invitations), token) },
    {
      name: 'POST /api/invitations',
      roles: ['admin'],
      successStatus: 201,
      call: (token) => withToken(request(context.app).post(API.invitations), token).send({ email: `role-invite-${++inviteNumber}@isallo.test`, roles: ['volunteer'] }),
      sideEffectCount: () => count('invitation'),
    },
    {
      name: 'POST /api/invitations/:invitationId/resend',
      roles: ['admin'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).post(API.invitationResend(invitationId)), token),
      sideEffectCount: () => count('people_change'),
    },
    {
      name: 'DELETE /api/invitations/:invitationId',
      roles: ['admin'],
      successStatus: 204,
      call: async (token) => {
        const fresh = await invitationsRepository.insertInvitation(context.db, {
          email: `role-withdraw-${++inviteNumber}@isallo.test`,
          roles: ['volunteer'],
          tokenHash: `hash-${inviteNumber}`,
          invitedBy: people.admin.id,
          expiresAt: new Date(Date.now() + 3600_000),
        });
        return withToken(request(context.app).delete(API.invitation(fresh.id)), token);
      },
      sideEffectCount: async () => (await context.db.selectFrom('invitation').select('id').where('withdrawn_at', 'is not', null).execute()).length,
    },
    { name: 'GET /api/dev/mails', roles: ['admin'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.capturedMails), token) },
    {
      name: 'PATCH /api/auth/me',
      roles: ROLES,
      successStatus: 200,
      call: (token) => withToken(request(context.app).patch(API.me), token).send({ displayName: `Renamed ${++inviteNumber}` }),
      sideEffectCount: () => count('people_change'),
    },
    {
      name: 'POST /api/auth/me/password',
      roles: ROLES,
      successStatus: 200,
      // Ends the caller's other sessions: a person of the same role made for the call, so the table's people keep theirs.
      call: async (token) =>
        withToken(request(context.app).post(API.myPassword), await throwawayToken(token)).send({ currentPassword: TEST_PASSWORD, newPassword: 'stylus-on-the-drum-7' }),
      sideEffectCount: () => count('people_change'),
    },
    {
      name: 'POST /api/auth/me/sign-out-everywhere',
      roles: ROLES,
      successStatus: 204,
      call: async (token) => withToken(request(context.app).post(API.signOutEverywhere), await throwawayToken(token)),
      sideEffectCount: () => count('people_change'),
    },
    { name: 'GET /api/lessons', roles: ['teacher', 'admin'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.lessons), token) },
    {
      name: 'POST /api/lessons',
      roles: ['teacher', 'admin'],
      successStatus: 201,
      call: (token) =>
        withToken(request(context.app).post(API.lessons), token).send({ title: 'Role lesson', audience: '', description: '', stationId, from: '2026-03-02T00:00Z', to: '2026-03-04T00:00Z' }),
      sideEffectCount: () => count('lesson'),
    },
    { name: 'GET /api/lessons/:lessonId', roles: ['teacher', 'admin'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.lesson(lessonId)), token) },
    {
      name: 'PATCH /api/lessons/:lessonId',
      roles: ['teacher', 'admin'],
      successStatus: 200,
      call: async (token) => withToken(request(context.app).patch(API.lesson(lessonId)), token).send({ version: await versionOf('lesson', lessonId), audience: 'edited' }),
    },
    {
      name: 'DELETE /api/lessons/:lessonId',
      roles: ['teacher', 'admin'],
      successStatus: 204,
      call: async (token) => {
        const doomed = await request(context.app)
          .post(API.lessons)
          .set('Authorization', `Bearer ${people.teacher.token}`)
          .send({ title: 'To delete', audience: '', description: '', stationId, from: '2026-03-02T00:00Z', to: '2026-03-03T00:00Z' });
        return withToken(request(context.app).delete(API.lesson(doomed.body.id)).query({ version: 1 }), token);
      },
    },
    {
      name: 'POST /api/lessons/:lessonId/copy',
      roles: ['teacher', 'admin'],
      successStatus: 201,
      call: (token) => withToken(request(context.app).post(API.lessonCopy(lessonId)), token),
      sideEffectCount: () => count('lesson'),
    },
    { name: 'GET /api/lessons/:lessonId/passage', roles: ['teacher', 'admin'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.lessonPassage(lessonId)), token) },
    {
      name: 'GET /api/lessons/:lessonId/regions/:index/image.jpg',
      roles: ['teacher', 'admin'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(`${API.lesson(lessonId)}/regions/0/image.jpg`), token),
    },
    {
      name: 'GET /api/lessons/:lessonId/annotations',
      roles: ['teacher', 'admin'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).get(API.lessonAnnotations(lessonId)), token),
    },
    { name: 'GET /api/lessons/:lessonId/shares', roles: ['teacher', 'admin'], successStatus: 200, call: (token) => withToken(request(context.app).get(API.lessonShares(lessonId)), token) },
    {
      name: 'POST /api/lessons/:lessonId/shares',
      roles: ['teacher', 'admin'],
      successStatus: 201,
      call: (token) => withToken(request(context.app).post(API.lessonShares(lessonId)), token).send({ expiresAt: null }),
      sideEffectCount: () => count('lesson_share'),
    },
    {
      name: 'PATCH /api/lessons/:lessonId/shares/:shareId',
      roles: ['teacher', 'admin'],
      successStatus: 200,
      call: (token) => withToken(request(context.app).patch(API.lessonShare(lessonId, lessonShareId)), token).send({ expiresAt: '2099-01-01T00:00Z' }),
    },
  ];

  const allowedCases = routes.flatMap((route) => route.roles.map((role) => [route.name, role] as const));
  const refusedCases = routes.flatMap((route) => ROLES.filter((role) => !route.roles.includes(role)).map((role) => [route.name, role] as const));
  const routeNamed = (name: string): RouteCase => routes.find((route) => route.name === name) as RouteCase;

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    for (const role of ROLES) people[role] = await createPerson(context.db, [role]);
    editedPersonId = (await createPerson(context.db, ['volunteer'])).id;
    invitationId = (
      await invitationsRepository.insertInvitation(context.db, {
        email: 'role-resend@isallo.test',
        roles: ['volunteer'],
        tokenHash: 'role-resend-hash',
        invitedBy: people.admin.id,
        expiresAt: new Date(Date.now() + 3600_000),
      })
    ).id;
    stationId = (await createStation(context.db)).id;
    chartFormId = (await createChartForm(context.db)).id;
    const tempPath = context.storage.newTempPath('.upload');
    // Large enough to hold the synthetic weekly placement: the hand-in refuses pins and knots off the image.
    await fs.writeFile(tempPath, await makePng(1600, 800));
    instrumentId = (await instrumentsRepository.insertInstrument(context.db, stationId, { serial: 'I-1', maker: '', installedOn: null, removedOn: null, notes: '' })).id;
    editableFormId = (await createChartForm(context.db)).id;
    batchId = (await intakeRepository.insertBatch(context.db, 'roles', people.archivist.id)) as string;
    statusScanId = await createScanRow(context.db, { stationId, chartFormId, uploadedBy: people.archivist.id, chartStart: null, status: 'received' });
    failedScanId = await createScanRow(context.db, { stationId, chartFormId, uploadedBy: people.archivist.id, chartStart: null, status: 'received', derivativeState: 'failed' });
    const scan = await scansService.uploadScan(
      context,
      { tempPath, originalName: 'role-table.png' },
      { stationId, chartFormId, chartStart: new Date(PERIOD_START) },
      people.archivist.id,
    );
    scanId = scan.id;
    draftScanId = await createScanRow(context.db, { stationId, chartFormId, uploadedBy: people.archivist.id, chartStart: PERIOD_START });
    // A scan with an approved line is in its station's series: a climatologist may then read its images.
    const seriesTempPath = context.storage.newTempPath('.upload');
    await fs.writeFile(seriesTempPath, await makePng(400, 200));
    seriesScanId = (
      await scansService.uploadScan(context, { tempPath: seriesTempPath, originalName: 'role-series.png' }, { stationId, chartFormId, chartStart: new Date(PERIOD_START) }, people.archivist.id)
    ).id;
    await createInkLineWithPoints(context.db, { scanId: seriesScanId, stationId, authorId: people.volunteer.id, status: 'approved', points: [] });
    // No worker runs here: the scan is left as the worker leaves a whole upload, ready to trace.
    await context.db.updateTable('scan').set({ collection: 'ROLE', box: '1', status: 'ready_to_trace' }).where('id', '=', scanId).execute();
    // A lesson of the teacher over a traced front, so the passage has a chart region; and a live share link.
    const lessonStationId = (await createStation(context.db)).id;
    await createTracedFrontScan(context, {
      stationId: lessonStationId,
      chartFormId,
      form: TEST_WEEKLY_FORM,
      chartStart: PERIOD_START,
      archivistId: people.archivist.id,
      volunteerId: people.volunteer.id,
    });
    const lesson = await request(context.app)
      .post(API.lessons)
      .set('Authorization', `Bearer ${people.teacher.token}`)
      .send({ title: 'Roles', audience: '', description: '', stationId: lessonStationId, from: '2026-03-02T12:00Z', to: '2026-03-04T12:00Z' });
    lessonId = lesson.body.id;
    const link = await request(context.app).post(API.lessonShares(lessonId)).set('Authorization', `Bearer ${people.teacher.token}`).send({ expiresAt: null });
    lessonShareId = link.body.id;
    lessonToken = link.body.token;
    // Many fixtures (people, scans, a traced front, a lesson): seconds on a loaded machine.
  }, 30_000);

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  // A call's own arrangement (a fresh ink line on a scan of its own, a throwaway person) adds rows to these
  // tables just before the request; any row already stored must still be there unchanged all the same.
  const ARRANGED_TABLES = ['scan', 'ink_line', 'pin_set', 'series_change', 'person', 'person_role', 'chart_claim', 'invitation', 'lesson', 'lesson_share'];

  it.each(routes.map((route) => [route.name]))('when %s is called without a token, then it answers 401 unauthenticated and changes nothing', async (name) => {
    const route = routeNamed(name);
    const before = await route.sideEffectCount?.();
    const stored = await readStoredState(context.db);

    const response = await route.call(null);

    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('unauthenticated');
    expect(await route.sideEffectCount?.()).toBe(before);
    expect(storedChanges(stored, await readStoredState(context.db), ARRANGED_TABLES)).toEqual([]);
  });

  it.each(refusedCases)('when %s is called by a %s, then it answers 403 forbidden and changes nothing', async (name, role) => {
    const route = routeNamed(name);
    const before = await route.sideEffectCount?.();
    const stored = await readStoredState(context.db);

    const response = await route.call(people[role].token);

    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('forbidden');
    expect(await route.sideEffectCount?.()).toBe(before);
    // Every stored row, not only the route's own table (issue 13 §4: each refused mutating route is checked).
    expect(storedChanges(stored, await readStoredState(context.db), ARRANGED_TABLES)).toEqual([]);
  });

  it.each(allowedCases)('when %s is called by a %s, then it succeeds', async (name, role) => {
    const route = routeNamed(name);
    const before = await route.sideEffectCount?.();

    const response = await route.call(people[role].token);

    expect(response.status).toBe(route.successStatus);
    if (before !== undefined) expect(await route.sideEffectCount?.()).toBe(before + 1);
  });

  it('when a person holds two roles, then they may call the routes of either', async () => {
    const both = await createPerson(context.db, ['archivist', 'climatologist']);

    const scans = await request(context.app).get(API.scans).set('Authorization', `Bearer ${both.token}`);
    const series = await request(context.app)
      .get(API.series)
      .query({ stationId, from: '2026-03-01', to: '2026-03-08' })
      .set('Authorization', `Bearer ${both.token}`);
    const people = await request(context.app).get(API.people).set('Authorization', `Bearer ${both.token}`);

    expect(scans.status).toBe(200);
    expect(series.status).toBe(200);
    expect(people.status).toBe(403);
  });

  it('when a climatologist asks for the images of a scan with no approved line, then each image route answers 403', async () => {
    const handedInScanId = await createScanRow(context.db, { stationId, chartFormId, uploadedBy: people.archivist.id, chartStart: PERIOD_START, status: 'traced' });
    await createInkLineWithPoints(context.db, { scanId: handedInScanId, stationId, authorId: people.volunteer.id, status: 'handed_in', points: [] });
    const asClimatologist = (path: string) => request(context.app).get(path).redirects(0).set('Authorization', `Bearer ${people.climatologist.token}`);

    const answers = await Promise.all([IIIF.imageBase(handedInScanId), IIIF.info(handedInScanId), IIIF.image(handedInScanId, 'full', '!100,100')].map(asClimatologist));
    const volunteerInfo = await request(context.app).get(IIIF.info(draftScanId)).set('Authorization', `Bearer ${people.volunteer.token}`);

    expect(answers.map((answer) => answer.status)).toEqual([403, 403, 403]);
    expect(answers.map((answer) => answer.body.error.code)).toEqual(['forbidden', 'forbidden', 'forbidden']);
    // The rule is the climatologist's only: a volunteer passes the same check (and then finds no file).
    expect(volunteerInfo.status).not.toBe(403);
  });

  it('when the public routes are called without a token, then they answer', async () => {
    const health = await request(context.app).get(API.health);
    const signIn = await request(context.app).post(API.signIn).send({ email: people.teacher.email, password: people.teacher.password });

    expect(health.status).toBe(200);
    expect(signIn.status).toBe(200);
    expect(signIn.body.person.roles).toEqual(['teacher']);
  });

  it('when a share link and its chart region are opened without a token, then they answer', async () => {
    const shared = await request(context.app).get(API.sharedLesson(lessonToken));
    const image = await request(context.app).get(shared.body.passage.regions[0].imagePath);

    expect(shared.status).toBe(200);
    expect(image.status).toBe(200);
  });
});
