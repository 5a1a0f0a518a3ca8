/**
 * One chart, end to end through the real UI: an archivist uploads a generated scan, a volunteer takes it from
 * the Desk's queue, pins its grid and clicks along the pen line on the Bench and hands it in; the archivist
 * returns it with a note, the volunteer reworks it and hands it in again, the archivist approves it, and only
 * then does the climatologist's station series (and its CSV) hold the line.
 * The chart is invented by fixtures/generator, so the true pressure at every hour is known.
 */
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { generateChart } from '../../fixtures/generator/generate-chart';
import { pixelFromReading } from '../../fixtures/generator/sheet-layout';
import type { RunningServer } from '../../server/server';
import { apiCall, tokenFor } from '../helpers/api-client';
import { startE2eServer } from '../helpers/e2e-server';
import { readStageView, toScreen } from '../helpers/stage-view';
import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';
import { chooseOption, launchChromium, signIn, signOut, type BrowserSession } from '../helpers/browser';

const CHART_START = '2026-04-06T00:00:00Z';
const HOUR_MS = 3_600_000;

jest.setTimeout(240_000);

function parseCsv(text: string): string[][] {
  return text.trim().split('\n').map((line) => line.split(','));
}

describe('one chart from upload to station series', () => {
  let workDir: string;
  let server: RunningServer;
  let chromium: BrowserSession;

  beforeAll(async () => {
    ({ server, workDir } = await startE2eServer('one-chart', { withWorker: true }));
    chromium = await launchChromium();
  });

  afterAll(async () => {
    await chromium?.close();
    await server?.close();
    rmSync(workDir, { recursive: true, force: true });
  });

  it('when a volunteer hands in, the archivist returns it, the volunteer reworks it and the archivist approves it, then the CSV holds the traced pressures and not before', async () => {
    // Arrange: an invented weekly chart at 150 dpi, with its grid crossings and true pressures known.
    const chart = await generateChart({ seed: 23, dpi: 150, chartStart: CHART_START });
    const scanPath = join(workDir, 'saltmere-week-15.png');
    writeFileSync(scanPath, chart.image);
    const pins = chart.chartJson['pins'] as { xPx: number; yPx: number; time: string; pressure: number }[];
    const chartStartMs = Date.parse(CHART_START);
    const firstHour = Math.ceil(chart.scene.chartOnHours) + 1;
    const lastHour = Math.floor(chart.scene.chartOffHours) - 1;
    const knotHours: number[] = [];
    for (let h = firstHour; h <= lastHour; h += 2) knotHours.push(h);
    // As a volunteer would, click the foot, middle and top of the ten-minute pressure jump as well.
    const jumpHours = chart.scene.story.jumpHours;
    knotHours.push(jumpHours - 0.2, jumpHours, jumpHours + 0.2);
    knotHours.sort((a, b) => a - b);
    const page = await chromium.browser.newPage({ viewport: { width: 1500, height: 950 }, acceptDownloads: true });

    // Act 1: the archivist uploads the scan for Saltmere Bay School.
    await signIn(page, server.url, 'archivist@isallo.test', DEMO_PASSWORD);
    await page.getByTestId('nav-archive').click();
    // The one-scan upload with full metadata sits on the Intake tab, below the batch drop zone.
    await page.getByTestId('archive-tab-intake').click();
    await page.getByTestId('upload-file').setInputFiles(scanPath);
    await chooseOption(page, 'upload-station', 'Saltmere Bay School');
    await chooseOption(page, 'upload-chart-form', 'Generated weekly 950–1050 hPa');
    await page.getByTestId('upload-chart-start').fill('2026-04-06T00:00Z');
    await page.getByTestId('upload-submit').click();
    await page.getByTestId('upload-result').filter({ hasText: /stored/i }).waitFor();
    await page.getByTestId('archive-tab-catalogue').click();
    await page.getByTestId('catalogue-row').filter({ hasText: 'saltmere-week-15.png' }).waitFor();
    await signOut(page);

    // The demo's own ready chart is older and would come first: the archivist puts this one ahead in the queue.
    const archivistToken = await tokenFor(server.url, 'archivist@isallo.test');
    const climatologistToken = await tokenFor(server.url, 'climatologist@isallo.test');
    const stations = await apiCall<{ items: { id: string; name: string }[] }>(server.url, archivistToken, '/api/stations?pageSize=200');
    const saltmereId = stations.items.find((station) => station.name === 'Saltmere Bay School')!.id;
    // The demo has no Saltmere Bay School scans: the one there is the one just uploaded.
    const found = await apiCall<{ items: { id: string }[] }>(server.url, archivistToken, `/api/scans?stationId=${saltmereId}`);
    const scanId = found.items[0].id;
    await apiCall(server.url, archivistToken, '/api/tracing/priorities', { method: 'PUT', body: JSON.stringify({ scope: 'scan', scanId, priority: 10 }) });
    const seriesPoints = async () =>
      (await apiCall<{ points: unknown[] }>(server.url, climatologistToken, `/api/series?stationId=${saltmereId}&from=2026-04-06&to=2026-04-12`)).points.length;

    // Act 2: the volunteer takes the next chart, pins four grid crossings and clicks knots along the pen line.
    const traceOnBench = async (isResumed: boolean) => {
      await page.getByTestId('scan-stage').locator('canvas').first().waitFor();
      await page.locator('[data-testid="scan-stage"][data-view-ready="true"]').waitFor();
      // A reworked line comes back onto the Bench with its pins: wait for them before deciding what to trace.
      // It reopens at the step where it was handed in, so the Pin step is opened to see them.
      if (isResumed) {
        await page.getByTestId('mode-pin').click();
        await expectCount(page, 'pin-row', 4);
      }
      let view = await readStageView(page);
      // A reworked line may come back onto the Bench with its pins and knots; only an empty Bench is traced again.
      if ((await page.getByTestId('pin-row').count()) === 0) {
        await page.getByTestId('mode-pin').click();
        for (const pin of pins.slice(0, 4)) {
          const at = toScreen(view, pin);
          await page.mouse.click(at.x, at.y);
          await page.getByTestId('pin-time').fill(pin.time.replace(':00Z', 'Z'));
          await page.getByTestId('pin-pressure').fill(String(pin.pressure));
          await page.getByTestId('pin-save').click();
        }
      }
      await expectCount(page, 'pin-row', 4);
      await page.getByTestId('mode-ink').click();
      await page.getByTestId('knot-count').waitFor();
      // Read the view after the Ink step is open: the step's panel can move the stage, and clicks read before would miss.
      await page.locator('[data-testid="scan-stage"][data-view-ready="true"]').waitFor();
      view = await readStageView(page);
      if ((await page.getByTestId('knot-count').getAttribute('data-count')) === '0') {
        for (const hours of knotHours) {
          const at = toScreen(view, pixelFromReading(chart.layout, { hours, pressure: chart.scene.story.pressureHpaAt(hours) }));
          await page.mouse.click(at.x, at.y);
        }
      }
      await page.getByTestId('knot-count').filter({ hasText: String(knotHours.length) }).waitFor();
      await page.getByTestId('hand-in').click();
      const result = page.getByTestId('hand-in-result');
      await result.waitFor();
      return Number(await result.getAttribute('data-point-count'));
    };
    await signIn(page, server.url, 'volunteer@isallo.test', DEMO_PASSWORD);
    await page.getByTestId('nav-desk').click();
    await page.getByTestId('next-chart').click();
    await page.locator(`[data-testid="desk-claim"][data-scan-id="${scanId}"]`).waitFor();
    await page.getByTestId('claim-open').click();
    await traceOnBench(false);
    await signOut(page);
    const pointsAfterHandIn = await seriesPoints();

    // Act 3: the archivist returns it from Review with a note.
    await signIn(page, server.url, 'archivist@isallo.test', DEMO_PASSWORD);
    await page.getByTestId('nav-archive').click();
    await page.getByTestId('archive-tab-review').click();
    await page.getByTestId('review-row').filter({ hasText: 'saltmere-week-15.png' }).getByTestId('review-open').click();
    await page.getByTestId('review-ink').waitFor();
    // The ghost grid is drawn from the line's own pins: two of its labelled lines (the 1000 hPa line and the
    // day-5 arc of the generated form, labelled every 10 hPa and 24 h) cross where the printed ones cross.
    const majorPath = await page.getByTestId('review-ghost-grid').locator('path.major').getAttribute('d');
    const printedCrossing = pixelFromReading(chart.layout, { hours: 96, pressure: 1000 });
    const nearbyLines = polylinesOf(majorPath ?? '').filter((line) => distanceToPolyline(printedCrossing, line) < 3);
    const residualLabels = await page.getByTestId('review-pin-residual').allTextContents();
    await page.getByTestId('review-note').fill('Please check the pins against the printed grid once more.');
    await page.getByTestId('review-return').click();
    await page.getByTestId('review-done').waitFor();
    await signOut(page);
    const pointsAfterReturn = await seriesPoints();

    // Act 4: the volunteer sees it returned with the note, reworks it on the Bench and hands it in again.
    await signIn(page, server.url, 'volunteer@isallo.test', DEMO_PASSWORD);
    await page.getByTestId('nav-desk').click();
    const returnedRow = page.getByTestId('desk-returned-table').getByTestId('desk-line').filter({ hasText: 'saltmere-week-15.png' });
    await returnedRow.getByTestId('return-note').filter({ hasText: 'check the pins against the printed grid' }).waitFor();
    await returnedRow.getByTestId('rework').click();
    const handedInPointCount = await traceOnBench(true);
    await signOut(page);
    const pointsBeforeApproval = await seriesPoints();

    // Act 5: the archivist approves it.
    await signIn(page, server.url, 'archivist@isallo.test', DEMO_PASSWORD);
    await page.getByTestId('nav-archive').click();
    await page.getByTestId('archive-tab-review').click();
    await page.getByTestId('review-row').filter({ hasText: 'saltmere-week-15.png' }).getByTestId('review-open').click();
    await page.getByTestId('review-approve').click();
    await page.getByTestId('review-line-status').filter({ hasText: 'approved' }).waitFor();
    await signOut(page);

    // Act 6: the climatologist shows the week and downloads it.
    await signIn(page, server.url, 'climatologist@isallo.test', DEMO_PASSWORD);
    await page.getByTestId('nav-series').click();
    await chooseOption(page, 'series-station', 'Saltmere Bay School');
    await page.getByTestId('series-from').fill('2026-04-06');
    await page.getByTestId('series-to').fill('2026-04-12');
    await page.getByTestId('series-show').click();
    await page.getByTestId('series-plot').getByTestId('series-line').waitFor();
    const downloadPromise = page.waitForEvent('download');
    await page.getByTestId('series-download').click();
    const download = await downloadPromise;
    const csvPath = join(workDir, 'series.csv');
    await download.saveAs(csvPath);
    // The Series page downloads the shown range from the query API: a commented header, then the rows.
    const rows = parseCsv(readFileSync(csvPath, 'utf8')).filter((row) => !row[0].startsWith('#'));

    // Assert: hourly rows between the first and last knot, each within 0.6 hPa of the invented truth
    // (a click lands within half a screen pixel, about 0.15 hPa at this scale; the straight segments between
    // two-hourly knots cut the curve's corners by a few tenths).
    expect(rows[0]).toEqual(['station_code', 'time', 'pressure_hpa', 'flag', 'uncertainty_hpa', 'ink_line_id']);
    const body = rows.slice(1);
    // The first and last knot land a few seconds either side of their hour, so one end hour may drop out.
    const spanHours = knotHours[knotHours.length - 1] - knotHours[0] + 1;
    expect(body.length).toBeGreaterThanOrEqual(spanHours - 2);
    expect(body.length).toBeLessThanOrEqual(spanHours);
    for (const [, time, pressure, flag] of body) {
      expect(time).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:00:00\.000Z$/);
      const hours = (Date.parse(time) - chartStartMs) / HOUR_MS;
      // Straight segments between hand knots cannot follow the jump's own ten minutes; judge the rest.
      if (Math.abs(hours - jumpHours) < 0.2) continue;
      expect(Math.abs(Number(pressure) - chart.scene.story.pressureHpaAt(hours))).toBeLessThan(0.6);
      // Knots two hours apart span more than the hourly step, so resampleRegular marks the points between them.
      expect(flag).toBe('interpolated');
    }
    expect(handedInPointCount).toBe(body.length);
    expect(nearbyLines).toHaveLength(2);
    expect(residualLabels).toHaveLength(4);
    for (const label of residualLabels) expect(label.trim()).toMatch(/^\d: [+−]?\d+\.\d{2} hPa, [+−]?\d+\.\d min$/);
    // Not before: the handed-in, returned and re-handed-in line reached no series until it was approved.
    expect([pointsAfterHandIn, pointsAfterReturn, pointsBeforeApproval]).toEqual([0, 0, 0]);
    await page.close();
  });
});

async function expectCount(page: Page, testId: string, count: number): Promise<void> {
  await page.waitForFunction(
    ([id, n]) => document.querySelectorAll(`[data-testid="${id}"]`).length === n,
    [testId, count] as const,
  );
}

/** The subpaths of SVG path data made of M and L commands, as point lists. */
function polylinesOf(d: string): { xPx: number; yPx: number }[][] {
  return d
    .split('M')
    .filter((part) => part.trim() !== '')
    .map((part) => part.split('L').map((pair) => {
      const [x, y] = pair.trim().split(/\s+/).map(Number);
      return { xPx: x, yPx: y };
    }));
}

/** Shortest distance from a point to a polyline, px. */
function distanceToPolyline(point: { xPx: number; yPx: number }, line: { xPx: number; yPx: number }[]): number {
  let best = Number.POSITIVE_INFINITY;
  for (let i = 1; i < line.length; i++) {
    const a = line[i - 1];
    const b = line[i];
    const dx = b.xPx - a.xPx;
    const dy = b.yPx - a.yPx;
    const t = Math.max(0, Math.min(1, ((point.xPx - a.xPx) * dx + (point.yPx - a.yPx) * dy) / (dx * dx + dy * dy || 1)));
    best = Math.min(best, Math.hypot(point.xPx - (a.xPx + t * dx), point.yPx - (a.yPx + t * dy)));
  }
  return best;
}
