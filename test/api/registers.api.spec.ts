import request from 'supertest';
import type { ChartFormSummary } from '@shared/api/chart-forms';
import type { InstrumentSummary } from '@shared/api/instruments';
import { API } from '@shared/api/routes';
import type { StationSummary } from '@shared/api/stations';
import { createChartForm, createPerson, createScanRow, createStation, TEST_WEEKLY_FORM, type TestPerson } from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

const NEW_STATION = {
  code: 'hlw',
  name: 'Heron Law',
  latitude: 55.1,
  longitude: -2.2,
  elevationM: 230,
  barometerHeightM: 231.4,
  timeZone: 'Europe/London',
  wigosId: '0-20000-0-03999',
  timeStandard: 'local_standard',
  historyNotes: 'Moved 300 m uphill in 1948.',
};

describe('registers: stations, instruments, chart forms', () => {
  let context: TestContext;
  let archivist: TestPerson;
  let teacher: TestPerson;

  const asArchivist = (call: request.Test) => call.set('Authorization', `Bearer ${archivist.token}`);

  beforeAll(async () => {
    context = await createTestContext();
  });

  beforeEach(async () => {
    await truncateTables(context.db);
    archivist = await createPerson(context.db, ['archivist']);
    teacher = await createPerson(context.db, ['teacher']);
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  describe('stations', () => {
    it('when an archivist creates a station, then it is stored with every register field and version 1', async () => {
      const response = await asArchivist(request(context.app).post(API.stations)).send(NEW_STATION);

      expect(response.status).toBe(201);
      expect(response.body).toEqual<StationSummary>({ ...NEW_STATION, code: 'HLW', id: expect.any(String), timeStandard: 'local_standard', version: 1 });
      const read = await request(context.app).get(API.station(response.body.id)).set('Authorization', `Bearer ${teacher.token}`);
      expect(read.body).toEqual(response.body);
    });

    it('when the fields are bad, then it answers 400 naming each one', async () => {
      const response = await asArchivist(request(context.app).post(API.stations)).send({
        code: 'x',
        name: '',
        latitude: 95,
        timeZone: 'Mars/Olympus',
        wigosId: 'KRO',
        timeStandard: 'summer',
      });

      expect(response.status).toBe(400);
      expect(Object.keys(response.body.error.details).sort()).toEqual(['code', 'latitude', 'name', 'timeStandard', 'timeZone', 'wigosId']);
    });

    it('when a second station takes the same code, then it answers 409 naming code', async () => {
      await asArchivist(request(context.app).post(API.stations)).send(NEW_STATION);

      const response = await asArchivist(request(context.app).post(API.stations)).send({ ...NEW_STATION, wigosId: null });

      expect(response.status).toBe(409);
      expect(response.body.error.code).toBe('station_identifier_taken');
      expect(response.body.error.details).toEqual({ code: 'already used by another station' });
    });

    it('when a station is edited at its version, then the change is kept and the version goes up; a stale version is 409', async () => {
      const created = (await asArchivist(request(context.app).post(API.stations)).send(NEW_STATION)).body as StationSummary;

      const edited = await asArchivist(request(context.app).patch(API.station(created.id))).send({ version: 1, timeStandard: 'utc', historyNotes: 'UTC from 1950.' });
      const stale = await asArchivist(request(context.app).patch(API.station(created.id))).send({ version: 1, name: 'Heron Law Farm' });

      expect(edited.status).toBe(200);
      expect(edited.body).toMatchObject({ timeStandard: 'utc', historyNotes: 'UTC from 1950.', name: 'Heron Law', version: 2 });
      expect(stale.status).toBe(409);
      expect(stale.body.error).toMatchObject({ code: 'version_conflict', details: { currentVersion: 2 } });
      const row = await context.db.selectFrom('station').selectAll().where('id', '=', created.id).executeTakeFirstOrThrow();
      expect(row).toMatchObject({ name: 'Heron Law', time_standard: 'utc', version: 2 });
    });

    it('when a PATCH has no version, then it answers 400 naming version', async () => {
      const station = await createStation(context.db);

      const response = await asArchivist(request(context.app).patch(API.station(station.id))).send({ name: 'No version' });

      expect(response.status).toBe(400);
      expect(Object.keys(response.body.error.details)).toEqual(['version']);
    });

    it('when a station id is unknown, then it answers 404 station_not_found', async () => {
      const response = await request(context.app).get(API.station('00000000-0000-4000-8000-000000000000')).set('Authorization', `Bearer ${teacher.token}`);

      expect(response.status).toBe(404);
      expect(response.body.error.code).toBe('station_not_found');
    });
  });

  describe('instruments', () => {
    it('when instruments are added to a station, then the station lists them by serial with their dates', async () => {
      const station = await createStation(context.db);
      await asArchivist(request(context.app).post(API.stationInstruments(station.id))).send({ serial: 'B-2204', maker: 'Fennick & Sons', installedOn: '1929-05-01', removedOn: '1936-10-12' });
      await asArchivist(request(context.app).post(API.stationInstruments(station.id))).send({ serial: 'A-17', maker: 'unknown' });

      const response = await request(context.app).get(API.stationInstruments(station.id)).set('Authorization', `Bearer ${teacher.token}`);

      expect(response.status).toBe(200);
      expect(response.body.total).toBe(2);
      expect(response.body.items).toEqual<InstrumentSummary[]>([
        { id: expect.any(String), stationId: station.id, serial: 'A-17', maker: 'unknown', installedOn: null, removedOn: null, notes: '', version: 1 },
        { id: expect.any(String), stationId: station.id, serial: 'B-2204', maker: 'Fennick & Sons', installedOn: '1929-05-01', removedOn: '1936-10-12', notes: '', version: 1 },
      ]);
    });

    it('when the removal date is before the installation, then it answers 400 naming removedOn', async () => {
      const station = await createStation(context.db);

      const response = await asArchivist(request(context.app).post(API.stationInstruments(station.id))).send({ serial: 'C-1', installedOn: '1930-01-01', removedOn: '1929-12-31' });

      expect(response.status).toBe(400);
      expect(Object.keys(response.body.error.details)).toEqual(['removedOn']);
    });

    it('when an instrument is edited, then its version goes up and a stale edit is 409', async () => {
      const station = await createStation(context.db);
      const created = (await asArchivist(request(context.app).post(API.stationInstruments(station.id))).send({ serial: 'D-9' })).body as InstrumentSummary;

      const edited = await asArchivist(request(context.app).patch(API.instrument(created.id))).send({ version: 1, removedOn: '1940-02-02', notes: 'pen arm bent' });
      const stale = await asArchivist(request(context.app).patch(API.instrument(created.id))).send({ version: 1, notes: 'lost edit' });

      expect(edited.status).toBe(200);
      expect(edited.body).toMatchObject({ removedOn: '1940-02-02', notes: 'pen arm bent', version: 2 });
      expect(stale.status).toBe(409);
      expect(stale.body.error.code).toBe('version_conflict');
    });

    it('when the station does not exist, then listing its instruments is 404', async () => {
      const response = await request(context.app).get(API.stationInstruments('00000000-0000-4000-8000-000000000000')).set('Authorization', `Bearer ${teacher.token}`);

      expect(response.status).toBe(404);
      expect(response.body.error.code).toBe('station_not_found');
    });
  });

  describe('chart forms', () => {
    it('when an archivist creates a chart form, then it is stored with version 1 and no scans', async () => {
      const response = await asArchivist(request(context.app).post(API.chartForms)).send({ ...TEST_WEEKLY_FORM, name: 'Weekly 28–31 inHg', pressureUnit: 'inHg', pressureMin: 28, pressureMax: 31, mmPerUnit: 30 });

      expect(response.status).toBe(201);
      expect(response.body).toEqual<ChartFormSummary>({
        ...TEST_WEEKLY_FORM,
        id: expect.any(String),
        name: 'Weekly 28–31 inHg',
        pressureUnit: 'inHg',
        pressureMin: 28,
        pressureMax: 31,
        mmPerUnit: 30,
        version: 1,
        scanCount: 0,
      });
    });

    it('when a second chart form takes the same name, then it answers 409 chart_form_name_taken naming name', async () => {
      await asArchivist(request(context.app).post(API.chartForms)).send({ ...TEST_WEEKLY_FORM, name: 'Weekly twin' });

      const response = await asArchivist(request(context.app).post(API.chartForms)).send({ ...TEST_WEEKLY_FORM, name: 'Weekly twin' });

      expect(response.status).toBe(409);
      expect(response.body.error.code).toBe('chart_form_name_taken');
      expect(Object.keys(response.body.error.details)).toEqual(['name']);
    });

    it('when the geometry cannot be drawn, then it answers 400 with checkChartForm messages', async () => {
      const response = await asArchivist(request(context.app).post(API.chartForms)).send({ ...TEST_WEEKLY_FORM, name: 'Bad', pressureMax: 940, penArmRadiusMm: 10 });

      expect(response.status).toBe(400);
      expect(response.body.error.details).toEqual({ pressureMax: 'pressureMax must be above pressureMin' });
    });

    it('when a pen arm is shorter than half the chart height, then the message names penArmRadiusMm', async () => {
      const response = await asArchivist(request(context.app).post(API.chartForms)).send({ ...TEST_WEEKLY_FORM, name: 'Short arm', penArmRadiusMm: 20 });

      expect(response.status).toBe(400);
      expect(response.body.error.details.penArmRadiusMm).toMatch(/smaller than half the chart height/);
    });

    it('when an unused form is edited at its version, then the change is kept', async () => {
      const form = await createChartForm(context.db);

      const response = await asArchivist(request(context.app).patch(API.chartForm(form.id))).send({ version: 1, gridHoursStep: 1 });

      expect(response.status).toBe(200);
      expect(response.body).toMatchObject({ gridHoursStep: 1, version: 2, scanCount: 0 });
    });

    it('when a form is used by a scan, then editing it answers 409 saying to create a new chart form', async () => {
      const form = await createChartForm(context.db);
      const station = await createStation(context.db);
      await createScanRow(context.db, { stationId: station.id, chartFormId: form.id, uploadedBy: archivist.id, chartStart: '1931-03-02T08:00Z' });

      const read = await request(context.app).get(API.chartForm(form.id)).set('Authorization', `Bearer ${teacher.token}`);
      const response = await asArchivist(request(context.app).patch(API.chartForm(form.id))).send({ version: 1, mmPerHour: 2 });

      expect(read.body.scanCount).toBe(1);
      expect(response.status).toBe(409);
      expect(response.body.error.code).toBe('chart_form_in_use');
      expect(response.body.error.message).toContain('create a new chart form instead');
      const row = await context.db.selectFrom('chart_form').select(['mm_per_hour', 'version']).where('id', '=', form.id).executeTakeFirstOrThrow();
      expect(row).toEqual({ mm_per_hour: TEST_WEEKLY_FORM.mmPerHour, version: 1 });
    });

    it('when a form edit is stale, then it answers 409 version_conflict', async () => {
      const form = await createChartForm(context.db);
      await asArchivist(request(context.app).patch(API.chartForm(form.id))).send({ version: 1, labelHoursStep: 12 });

      const response = await asArchivist(request(context.app).patch(API.chartForm(form.id))).send({ version: 1, labelHoursStep: 6 });

      expect(response.status).toBe(409);
      expect(response.body.error.code).toBe('version_conflict');
    });
  });

  describe('change log (issue 13 finding 7)', () => {
    const changeLog = (url: string, person: TestPerson = archivist) => request(context.app).get(url).set('Authorization', `Bearer ${person.token}`);

    it('when a station is created and edited, then its change log holds both, newest first, with before and after values and who made them', async () => {
      const created = await asArchivist(request(context.app).post(API.stations)).send(NEW_STATION);

      const edited = await asArchivist(request(context.app).patch(API.station(created.body.id))).send({ version: 1, name: 'Heron Law Hill', elevationM: 240, timeZone: 'Europe/London' });
      const log = await changeLog(API.stationChangeLog(created.body.id));

      expect(edited.status).toBe(200);
      expect(log.status).toBe(200);
      expect(log.body).toMatchObject({ total: 2, page: 0 });
      const [edit, create] = log.body.items;
      // The time zone was sent unchanged, so it is not in the entry.
      expect(edit).toMatchObject({ action: 'edit', personName: `Test Person ${archivist.email.split('@')[0]}`, changes: { name: { before: 'Heron Law', after: 'Heron Law Hill' }, elevationM: { before: 230, after: 240 } } });
      expect(Object.keys(edit.changes).sort()).toEqual(['elevationM', 'name']);
      expect(create).toMatchObject({ action: 'create', changes: { code: { before: null, after: 'HLW' }, name: { before: null, after: 'Heron Law' } } });
    });

    it('when an edit is refused for a stale version, then no change log entry is written', async () => {
      const station = await createStation(context.db);

      const stale = await asArchivist(request(context.app).patch(API.station(station.id))).send({ version: 7, name: 'Never' });

      expect(stale.status).toBe(409);
      expect(await context.db.selectFrom('register_change').selectAll().where('record_id', '=', station.id).execute()).toEqual([]);
    });

    it('when an instrument and a chart form are edited, then each log has the fields changed, before and after', async () => {
      const station = await createStation(context.db);
      const instrument = await asArchivist(request(context.app).post(API.stationInstruments(station.id))).send({ serial: 'B-12', maker: 'Short & Mason' });
      const form = await createChartForm(context.db);

      await asArchivist(request(context.app).patch(API.instrument(instrument.body.id))).send({ version: 1, maker: 'Negretti & Zambra', installedOn: '1931-01-05' });
      await asArchivist(request(context.app).patch(API.chartForm(form.id))).send({ version: 1, drumHours: 170 });
      const instrumentLog = await changeLog(API.instrumentChangeLog(instrument.body.id));
      const formLog = await changeLog(API.chartFormChangeLog(form.id));

      expect(instrumentLog.body.items[0]).toMatchObject({ action: 'edit', changes: { maker: { before: 'Short & Mason', after: 'Negretti & Zambra' }, installedOn: { before: null, after: '1931-01-05' } } });
      expect(instrumentLog.body.total).toBe(2);
      expect(formLog.body.items).toEqual([expect.objectContaining({ action: 'edit', changes: { drumHours: { before: TEST_WEEKLY_FORM.drumHours, after: 170 } } })]);
    });

    it('when a volunteer or teacher asks for a change log, then it is 403; an unknown station is 404; an admin may read it', async () => {
      const station = await createStation(context.db);
      const volunteer = await createPerson(context.db, ['volunteer']);
      const admin = await createPerson(context.db, ['admin']);

      const byVolunteer = await changeLog(API.stationChangeLog(station.id), volunteer);
      const byTeacher = await changeLog(API.stationChangeLog(station.id), teacher);
      const unknown = await changeLog(API.stationChangeLog('00000000-0000-4000-8000-000000000000'));
      const byAdmin = await changeLog(API.stationChangeLog(station.id), admin);

      expect([byVolunteer.status, byTeacher.status, unknown.status, byAdmin.status]).toEqual([403, 403, 404, 200]);
      expect(unknown.body.error.code).toBe('station_not_found');
    });
  });
});
