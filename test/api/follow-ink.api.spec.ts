import request from 'supertest';
import type { FollowInkResult } from '@shared/api/follow-ink';
import { API } from '@shared/api/routes';
import { INSTANT_EXAMPLE } from '@shared/api/parse-instant';
import type { ScanDetail } from '@shared/api/scans';
import { fitRegistration, pixelToReading } from '@shared/domain/registration';
import { generateChart, type GeneratedChart } from '../../fixtures/generator/generate-chart';
import { toRegistrationPins } from '../../server/ink-lines/ink-line-reading';
import { parseChartFile } from '../../scripts/digitize/chart-file';
import { digitizeChart } from '../../scripts/digitize/digitize-chart';
import { decodeImage } from '../../scripts/digitize/load-scan';
import { createChartForm, createPerson, createStation, TEST_WEEKLY_FORM, type TestPerson } from '../helpers/factories';
import { createTestContext, type TestContext, truncateTables } from '../helpers/test-app';

const PERIOD_START = '2026-03-02T00:00:00.000Z';
const PERIOD_START_MS = Date.parse(PERIOD_START);

interface ChartPin {
  xPx: number;
  yPx: number;
  time: string;
  pressure: number;
}

describe('Follow ink', () => {
  let context: TestContext;
  let volunteer: TestPerson;
  let archivist: TestPerson;
  let chart: GeneratedChart;
  let pins: ChartPin[];
  let scanId: string;

  function follow(body: unknown, token = volunteer.token) {
    return request(context.app).post(API.scanFollowInk(scanId)).set('Authorization', `Bearer ${token}`).send(body as object);
  }

  beforeAll(async () => {
    context = await createTestContext();
    chart = await generateChart({ seed: 11, dpi: 100 });
    pins = chart.chartJson['pins'] as ChartPin[];
  });

  beforeEach(async () => {
    await truncateTables(context.db);
    volunteer = await createPerson(context.db, ['volunteer']);
    archivist = await createPerson(context.db, ['archivist']);
    const stationId = (await createStation(context.db)).id;
    const chartFormId = (await createChartForm(context.db)).id;
    const uploaded = await request(context.app)
      .post(API.scans)
      .set('Authorization', `Bearer ${archivist.token}`)
      .field('stationId', stationId)
      .field('chartFormId', chartFormId)
      .field('chartStart', PERIOD_START)
      .attach('file', chart.image, `chart.${chart.extension}`);
    expect(uploaded.status).toBe(201);
    scanId = (uploaded.body as ScanDetail).id;
    // The catalogue work (chart on/off, ready to trace) is not what is tested here, so it is written straight to the row.
    await context.db
      .updateTable('scan')
      .set({
        status: 'ready_to_trace',
        chart_on: new Date(chart.chartJson['chartOn'] as string),
        chart_off: new Date(chart.chartJson['chartOff'] as string),
      })
      .where('id', '=', scanId)
      .execute();
  });

  afterAll(async () => {
    await truncateTables(context.db);
    await context.close();
  });

  it('when the volunteer follows the ink of a generated chart, then every knot away from the pressure jump reads within 0.5 hPa of the drawn pressure', async () => {
    const fit = fitRegistration(TEST_WEEKLY_FORM, toRegistrationPins({ pins, knots: [] }, PERIOD_START_MS));

    const response = await follow({ pins });

    expect(response.status).toBe(200);
    const result = response.body as FollowInkResult;
    const chartOnHours = (Date.parse(chart.chartJson['chartOn'] as string) - PERIOD_START_MS) / 3_600_000;
    const chartOffHours = (Date.parse(chart.chartJson['chartOff'] as string) - PERIOD_START_MS) / 3_600_000;
    // Thinned, not one per pixel column: the 100 dpi chart is about 1000 columns wide over the inked span.
    expect(result.knots.length).toBeGreaterThan(50);
    expect(result.knots.length).toBeLessThan(600);
    expect(result.lineWidthPx).toBeGreaterThan(0);
    // At the pressure jump the pen line is nearly upright and, at 100 dpi, one pixel column wide in time, so a
    // pressure "at that time" is not defined there; the half hour either side is checked for being followed
    // (knots on both sides of it) instead of by pressure.
    const jumpHours = chart.scene.story.jumpHours;
    let worstHpa = 0;
    const hoursNearJump: number[] = [];
    for (const knot of result.knots) {
      const reading = pixelToReading(TEST_WEEKLY_FORM, fit, knot.xPx, knot.yPx);
      expect(reading.hours).toBeGreaterThanOrEqual(chartOnHours - 0.5);
      expect(reading.hours).toBeLessThanOrEqual(chartOffHours + 0.5);
      expect(knot.confidence).toBeGreaterThanOrEqual(0);
      expect(knot.confidence).toBeLessThanOrEqual(1);
      if (Math.abs(reading.hours - jumpHours) <= 0.5) hoursNearJump.push(reading.hours);
      else worstHpa = Math.max(worstHpa, Math.abs(reading.pressure - chart.scene.story.pressureHpaAt(reading.hours)));
    }
    // Invented chart from fixtures/generator; tolerance: project bar (0.5 hPa).
    expect(worstHpa).toBeLessThan(0.5);
    expect(hoursNearJump.some((hours) => hours < jumpHours)).toBe(true);
    expect(hoursNearJump.some((hours) => hours > jumpHours)).toBe(true);
    for (const span of result.spans) {
      expect(span.fromIndex).toBeGreaterThanOrEqual(-1);
      expect(span.toIndex).toBeLessThanOrEqual(result.knots.length);
    }
  });

  it('when the Bench follows the ink of a scan and npm run digitize digitizes the same scan, then both give the same line', async () => {
    const parsed = parseChartFile(chart.chartJson);
    if (!parsed.ok) throw new Error(parsed.problems.join('; '));
    const offline = digitizeChart(await decodeImage(chart.image), parsed.value);
    const inkColour = chart.chartJson['ink'] as { colour: string };

    const response = await follow({ pins, inkColour: inkColour.colour });

    expect(response.status).toBe(200);
    const result = response.body as FollowInkResult;
    expect(result.inkModel).toBe(offline.trace.contrastMode);
    expect(result.coverage).toBeCloseTo(offline.trace.coverage, 9);
    expect(result.lineWidthPx).toBeCloseTo(offline.trace.lineWidthPx, 9);
    expect(result.knots.length).toBeGreaterThan(50);
    // Every knot is a point of the offline line (knots are the line thinned), read through one fit: same pressure.
    const fit = offline.registration;
    const { xPx, yPx } = offline.trace;
    let next = 0;
    for (const knot of result.knots) {
      while (next < xPx.length && Math.abs(xPx[next] - knot.xPx) > 1e-6) next++;
      expect(next).toBeLessThan(xPx.length);
      expect(Math.abs(yPx[next] - knot.yPx)).toBeLessThan(1e-6);
      const bench = pixelToReading(TEST_WEEKLY_FORM, fit, knot.xPx, knot.yPx);
      const digitized = pixelToReading(parsed.value.form, fit, xPx[next], yPx[next]);
      expect(Math.abs(bench.pressure - digitized.pressure)).toBeLessThan(1e-6);
      expect(Math.abs(bench.hours - digitized.hours)).toBeLessThan(1e-6);
    }
    expect(result.spans.map((s) => s.kind)).toEqual(offline.trace.spans.map((s) => s.kind));
  });

  it('when a pin has no time and another no pressure, then it is 400 with the field paths', async () => {
    const bad = [{ ...pins[0], time: 'soon' }, { ...pins[1], pressure: 'high' }, pins[2]];

    const response = await follow({ pins: bad });

    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(response.body.error.details).toEqual({ 'pins.0.time': `time must be a date and time, ${INSTANT_EXAMPLE}`, 'pins.1.pressure': 'pressure must be a number' });
  });

  it('when the pins all lie on one line, then it is 422 registration_failed', async () => {
    const collinear = [0, 1, 2].map((i) => ({ xPx: 100 + 50 * i, yPx: 200, time: `2026-03-0${2 + i}T00:00:00.000Z`, pressure: 1000 }));

    const response = await follow({ pins: collinear });

    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('registration_failed');
    expect(typeof response.body.error.details.reason).toBe('string');
  });

  it('when the scan is not ready to trace, then it is 409', async () => {
    await context.db.updateTable('scan').set({ status: 'received' }).where('id', '=', scanId).execute();

    const response = await follow({ pins });

    expect(response.status).toBe(409);
    expect(response.body.error.code).toBe('scan_not_traceable');
  });

  it('when an archivist asks, then it is 403', async () => {
    const response = await follow({ pins }, archivist.token);

    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('forbidden');
  });
});
