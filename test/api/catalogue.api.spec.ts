import request from 'supertest';
import type { ChartFormSummary } from '@shared/api/chart-forms';
import { API } from '@shared/api/routes';
import type { StationSummary } from '@shared/api/stations';
import { createChartForm, createPerson, createStation, TEST_WEEKLY_FORM, type TestPerson } from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

describe('stations and chart forms', () => {
  let context: TestContext;
  let teacher: TestPerson;

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    teacher = await createPerson(context.db, ['teacher']);
    await createStation(context.db, { code: 'ZED', name: 'Alder Moss', latitude: null, longitude: null, elevationM: null });
    await createStation(context.db, { code: 'ABE', name: 'Yarrow Point', latitude: 51.5, longitude: -0.25, elevationM: 12.5 });
    await createChartForm(context.db, { name: 'Weekly inHg', pressureUnit: 'inHg', pressureMin: 28, pressureMax: 31, mmPerUnit: 30, penArmRadiusMm: null, arcSide: -1 });
    await createChartForm(context.db, { name: 'Daily hPa', drumHours: 26, mmPerHour: 8, pivotPressure: 1000 });
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when stations are listed by code, then they come in code order with every field', async () => {
    const response = await request(context.app).get(API.stations).query({ sort: 'code' }).set('Authorization', `Bearer ${teacher.token}`);

    expect(response.status).toBe(200);
    expect(response.body.total).toBe(2);
    expect(response.body.items).toEqual<StationSummary[]>([
      { id: expect.any(String), code: 'ABE', name: 'Yarrow Point', latitude: 51.5, longitude: -0.25, elevationM: 12.5, timeZone: 'Europe/London', wigosId: null, barometerHeightM: null, timeStandard: 'local_standard', historyNotes: '', version: 1 },
      { id: expect.any(String), code: 'ZED', name: 'Alder Moss', latitude: null, longitude: null, elevationM: null, timeZone: 'Europe/London', wigosId: null, barometerHeightM: null, timeStandard: 'local_standard', historyNotes: '', version: 1 },
    ]);
  });

  it('when stations are listed without a sort, then they come by name', async () => {
    const response = await request(context.app).get(API.stations).set('Authorization', `Bearer ${teacher.token}`);

    expect(response.body.items.map((station: StationSummary) => station.name)).toEqual(['Alder Moss', 'Yarrow Point']);
  });

  it('when chart forms are listed, then each carries the whole chart form as stored', async () => {
    const response = await request(context.app).get(API.chartForms).query({ sort: 'name' }).set('Authorization', `Bearer ${teacher.token}`);

    expect(response.status).toBe(200);
    expect(response.body.items).toEqual<ChartFormSummary[]>([
      { ...TEST_WEEKLY_FORM, id: expect.any(String), name: 'Daily hPa', drumHours: 26, mmPerHour: 8, pivotPressure: 1000, version: 1, scanCount: 0 },
      {
        ...TEST_WEEKLY_FORM,
        id: expect.any(String),
        name: 'Weekly inHg',
        pressureUnit: 'inHg',
        pressureMin: 28,
        pressureMax: 31,
        mmPerUnit: 30,
        penArmRadiusMm: null,
        arcSide: -1,
        version: 1,
        scanCount: 0,
      },
    ]);
  });

  it('when a sort key is unknown, then it answers 400 naming sort', async () => {
    const response = await request(context.app).get(API.chartForms).query({ sort: 'unit' }).set('Authorization', `Bearer ${teacher.token}`);

    expect(response.status).toBe(400);
    expect(response.body.error.details).toHaveProperty('sort');
  });
});
