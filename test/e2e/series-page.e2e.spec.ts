/// <reference lib="dom" />
/**
 * The Series page through the real UI: the demo climatologist picks Kestrel Ridge, sees its coverage and
 * the whole record, brushes the overview to the demo's front, reads the detail plot there, and opens the
 * chart behind a point: the scan region through IIIF with the ink line drawn over it.
 */
import { rmSync } from 'node:fs';
import type { SeriesQueryResponse, StationCoverage } from '@shared/api/series-query';
import type { StationSummary } from '@shared/api/stations';
import type { Page as Paged } from '@shared/api/paging';
import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';
import type { RunningServer } from '../../server/server';
import { apiCall, tokenFor } from '../helpers/api-client';
import { chooseOption, launchChromium, signIn, type BrowserSession } from '../helpers/browser';
import { startE2eServer } from '../helpers/e2e-server';

const HOUR_MS = 3_600_000;
/** The overview's drawing box in its viewBox units (series-overview.ts): 960 wide, 56 left and 16 right margin. */
const OVERVIEW = { width: 960, left: 56, right: 16 };

jest.setTimeout(240_000);

describe('the Series page from the whole record to the chart behind a point', () => {
  let workDir: string;
  let server: RunningServer;
  let chromium: BrowserSession;

  beforeAll(async () => {
    ({ server, workDir } = await startE2eServer('series-page'));
    chromium = await launchChromium();
  });

  afterAll(async () => {
    await chromium?.close();
    await server?.close();
    rmSync(workDir, { recursive: true, force: true });
  });

  it('when the climatologist brushes the overview to the front and clicks a point, then the detail plot shows it and the chart opens through IIIF', async () => {
    // Arrange: the front is the lowest pressure of the demo's approved week at Kestrel Ridge.
    const token = await tokenFor(server.url, 'climatologist@isallo.test');
    const stations = await apiCall<Paged<StationSummary>>(server.url, token, '/api/stations?pageSize=100');
    const kestrel = stations.items.find((station) => station.code === 'KRO') as StationSummary;
    const coverage = await apiCall<StationCoverage>(server.url, token, `/api/stations/${kestrel.id}/coverage`);
    const recordMs = [Date.parse(coverage.first as string), Date.parse(coverage.last as string)];
    const raw = await apiCall<SeriesQueryResponse>(server.url, token, `/api/series/query?stationId=${kestrel.id}&from=${coverage.first}&to=${coverage.last}&step=raw`);
    const points = raw.stations[0].points as { time: string; pressureHpa: number }[];
    const trough = points.reduce((low, point) => (point.pressureHpa < low.pressureHpa ? point : low));
    const frontMs = Date.parse(trough.time);
    const page = await chromium.browser.newPage({ viewport: { width: 1400, height: 1100 } });

    // Act 1: the coverage strip and the overview appear as soon as the station is chosen.
    await signIn(page, server.url, 'climatologist@isallo.test', DEMO_PASSWORD);
    await page.getByTestId('nav-series').click();
    await chooseOption(page, 'series-station', 'Kestrel Ridge Observatory (KRO)');
    await page.getByTestId('coverage-strip').locator('rect.cell.data').first().waitFor();
    await page.getByTestId('overview-band').waitFor();

    // Act 2: brush the overview from 12 h before the front to 12 h after it.
    const box = await page.getByTestId('series-overview').boundingBox();
    if (!box) throw new Error('the overview is not on screen');
    const screenX = (timeMs: number) => {
      const fraction = (timeMs - recordMs[0]) / (recordMs[1] - recordMs[0]);
      return box.x + ((OVERVIEW.left + fraction * (OVERVIEW.width - OVERVIEW.left - OVERVIEW.right)) / OVERVIEW.width) * box.width;
    };
    const y = box.y + box.height * 0.4;
    await page.mouse.move(screenX(frontMs - 12 * HOUR_MS), y);
    await page.mouse.down();
    await page.mouse.move(screenX(frontMs), y, { steps: 5 });
    await page.mouse.move(screenX(frontMs + 12 * HOUR_MS), y, { steps: 5 });
    await page.mouse.up();

    // Assert 1: the typed days follow the brush, and the detail plot draws the day around the front.
    await page.waitForFunction((day) => (document.querySelector('[data-testid="series-from"]') as HTMLInputElement | null)?.value === day, new Date(frontMs - 12 * HOUR_MS).toISOString().slice(0, 10));
    const plot = page.getByTestId('series-plot');
    await plot.getByTestId('series-line').waitFor();
    await page.waitForFunction(() => {
      const count = Number(document.querySelector('[data-testid="series-point-count"]')?.getAttribute('data-count'));
      return count >= 18 && count <= 30;
    });
    expect(await plot.getByTestId('series-band').count()).toBeGreaterThan(0);
    expect(await page.getByTestId('flag-legend').count()).toBe(1);

    // Act 3: point at the middle of the plot (the front), read the value, then click to open the chart.
    const plotBox = await plot.boundingBox();
    if (!plotBox) throw new Error('the detail plot is not on screen');
    // The detail plot's drawing box spans 60–944 of its 960 viewBox units.
    const frontX = plotBox.x + ((60 + 0.5 * 884) / 960) * plotBox.width;
    await page.mouse.move(frontX, plotBox.y + plotBox.height / 2);
    await page.getByTestId('series-hover').filter({ hasText: 'hPa' }).waitFor();
    await page.mouse.click(frontX, plotBox.y + plotBox.height / 2);

    // Assert 2: the chart panel names the point's chart and shows the IIIF image with the ink line drawn.
    const panel = page.getByTestId('point-chart');
    await panel.waitFor();
    await page.waitForFunction(() => {
      const image = document.querySelector('[data-testid="chart-region-image"]') as HTMLImageElement | null;
      return image !== null && image.complete && image.naturalWidth > 0;
    });
    expect(await panel.textContent()).toContain(new Date(frontMs).toISOString().slice(0, 10));
    const inkPoints = await panel.locator('polyline.ink').getAttribute('points');
    expect((inkPoints ?? '').split(' ').length).toBeGreaterThan(10);
    expect(await panel.getByTestId('chart-mark').count()).toBe(1);
    await page.close();
  });

  it('when a teacher brushes three days and starts a lesson, then New lesson opens with the station and the range filled in', async () => {
    const token = await tokenFor(server.url, 'teacher@isallo.test');
    const stations = await apiCall<Paged<StationSummary>>(server.url, token, '/api/stations?pageSize=100');
    const kestrel = stations.items.find((station) => station.code === 'KRO') as StationSummary;
    const page = await chromium.browser.newPage({ viewport: { width: 1400, height: 1100 } });
    await signIn(page, server.url, 'teacher@isallo.test', DEMO_PASSWORD);
    await page.getByTestId('nav-series').click();
    await chooseOption(page, 'series-station', 'Kestrel Ridge Observatory (KRO)');
    await page.getByTestId('overview-band').waitFor();

    // Act: type three days, then follow the link.
    await page.getByTestId('series-from').fill('2026-03-03');
    await page.getByTestId('series-to').fill('2026-03-05');
    await page.getByTestId('series-show').click();
    await page.getByTestId('series-plot').getByTestId('series-line').waitFor();
    await page.getByTestId('series-start-lesson').click();

    // Assert: the lesson form holds the station and the range the plot showed.
    await page.getByTestId('new-lesson-from').waitFor();
    const url = new URL(page.url());
    expect(url.pathname).toBe('/lessons/new');
    expect(url.searchParams.get('stationId')).toBe(kestrel.id);
    expect(await page.getByTestId('new-lesson-from').inputValue()).toBe('2026-03-03T00:00:00.000Z');
    expect(await page.getByTestId('new-lesson-to').inputValue()).toBe('2026-03-05T23:59:59.999Z');
    expect(await page.getByTestId('new-lesson-station').textContent()).toContain('Kestrel Ridge Observatory');
    await page.close();
  });
});
