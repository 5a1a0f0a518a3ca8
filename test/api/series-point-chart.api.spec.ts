import request from 'supertest';
import { API, IIIF } from '@shared/api/routes';
import type { PointChart } from '@shared/api/series-point-chart';
import { createChartForm, createPerson, createStation, TEST_WEEKLY_FORM, type TestPerson } from '../helpers/factories';
import { createTracedFrontScan, frontPressureHpa } from '../helpers/lesson-fixtures';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

// Uploading a scan and handing in a traced line takes seconds on a loaded machine.
jest.setTimeout(60_000);

const CHART_START = '2026-03-02T00:00:00.000Z';
const HOUR_MS = 3_600_000;

describe('GET /api/series/point-chart', () => {
  let context: TestContext;
  let climatologist: TestPerson;
  let stationId: string;
  let scanId: string;
  let inkLineId: string;

  beforeAll(async () => {
    context = await createTestContext();
    await truncateTables(context.db);
    climatologist = await createPerson(context.db, ['climatologist']);
    const archivist = await createPerson(context.db, ['archivist']);
    const volunteer = await createPerson(context.db, ['volunteer']);
    stationId = (await createStation(context.db)).id;
    const chartFormId = (await createChartForm(context.db)).id;
    ({ scanId, inkLineId } = await createTracedFrontScan(context, {
      stationId,
      chartFormId,
      form: TEST_WEEKLY_FORM,
      chartStart: CHART_START,
      archivistId: archivist.id,
      volunteerId: volunteer.id,
    }));
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  function askPointChart(query: Record<string, string>, token = climatologist.token): request.Test {
    return request(context.app).get(API.seriesPointChart).query(query).set('Authorization', `Bearer ${token}`);
  }

  it('when a climatologist asks for the chart of a traced time, then the point, its line, scan, form and region come back', async () => {
    const timeMs = Date.parse(CHART_START) + 30 * HOUR_MS;

    const response = await askPointChart({ stationId, time: new Date(timeMs + 7 * 60_000).toISOString() });

    expect(response.status).toBe(200);
    const chart = response.body as PointChart;
    expect(chart).toMatchObject({ stationId, inkLineId, scanId, chartStart: CHART_START });
    expect(chart.chartFormName).toEqual(expect.any(String));
    expect(Math.abs(Date.parse(chart.time) - timeMs)).toBeLessThanOrEqual(HOUR_MS / 2);
    expect(chart.pressureHpa).toBeCloseTo(frontPressureHpa((Date.parse(chart.time) - Date.parse(CHART_START)) / HOUR_MS), 0);
    expect(chart.region).not.toBeNull();
    expect(chart.inkLine.length).toBeGreaterThan(10);
    const region = chart.region as NonNullable<PointChart['region']>;
    // The point's mark and every knot drawn lie inside the region.
    for (const knot of [chart.pointPx as { xPx: number; yPx: number }, ...chart.inkLine]) {
      expect(knot.xPx).toBeGreaterThanOrEqual(region.xPx);
      expect(knot.xPx).toBeLessThanOrEqual(region.xPx + region.widthPx);
      expect(knot.yPx).toBeGreaterThanOrEqual(region.yPx);
      expect(knot.yPx).toBeLessThanOrEqual(region.yPx + region.heightPx);
    }
    expect(chart.imagePath).toBe(IIIF.image(scanId, `${region.xPx},${region.yPx},${region.widthPx},${region.heightPx}`, `${Math.min(region.widthPx, 1600)},`));
  });

  it('when the climatologist then opens the region through IIIF, then the image is served', async () => {
    const chart = (await askPointChart({ stationId, time: '2026-03-03T12:00:00Z' })).body as PointChart;

    const image = await request(context.app).get(chart.imagePath as string).set('Authorization', `Bearer ${climatologist.token}`);

    expect(image.status).toBe(200);
    expect(image.headers['content-type']).toBe('image/jpeg');
  });

  it('when no traced point lies within three hours of the time, then it answers 404 not_found', async () => {
    const response = await askPointChart({ stationId, time: '2026-02-20T00:00:00Z' });

    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('not_found');
  });

  it('when the time or station is not readable, then it answers 400 naming each', async () => {
    const response = await askPointChart({ stationId: 'nope', time: 'yesterday' });

    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(Object.keys(response.body.error.details).sort()).toEqual(['stationId', 'time']);
  });

  it('when a volunteer asks, then it answers 403 forbidden', async () => {
    const volunteer = await createPerson(context.db, ['volunteer']);

    const response = await askPointChart({ stationId, time: '2026-03-03T12:00:00Z' }, volunteer.token);

    expect(response.status).toBe(403);
  });
});
