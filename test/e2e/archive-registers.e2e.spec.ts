/// <reference lib="dom" />
/**
 * The Archive's registers through the real UI: an archivist records a new station (WIGOS id, heights, zone,
 * time standard, history), its barograph, and a new daily chart form whose printed grid the page draws from
 * the numbers; a form that scans already use is shown locked. The station and instrument are invented.
 */
import { rmSync } from 'node:fs';
import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';
import type { RunningServer } from '../../server/server';
import { startE2eServer } from '../helpers/e2e-server';
import { chooseOption, launchChromium, signIn, waitForDialogReady, type BrowserSession } from '../helpers/browser';


jest.setTimeout(180_000);

describe('the archive registers', () => {
  let workDir: string;
  let server: RunningServer;
  let chromium: BrowserSession;

  beforeAll(async () => {
    ({ server, workDir } = await startE2eServer('registers'));
    chromium = await launchChromium();
  });

  afterAll(async () => {
    await chromium?.close();
    await server?.close();
    rmSync(workDir, { recursive: true, force: true });
  });

  it('when an archivist records a station, its barograph and a chart form, then each register lists them and the form draws its grid', async () => {
    // Arrange: a unique code, so a rerun against the same database adds a new station.
    const code = `GLN${Date.now() % 100000}`;
    const page = await chromium.browser.newPage({ viewport: { width: 1440, height: 950 } });
    await signIn(page, server.url, 'archivist@isallo.test', DEMO_PASSWORD);
    await page.getByTestId('nav-archive').click();

    // Act 1: a new station through the dialog.
    await page.getByTestId('archive-tab-stations').click();
    await page.getByTestId('station-new').click();
    await waitForDialogReady(page);
    await page.getByTestId('station-code').fill(code);
    await page.getByTestId('station-name').fill('Glenmarrow Lighthouse');
    await page.getByTestId('station-wigos').fill('0-20000-0-99871');
    await page.getByTestId('station-latitude').fill('57.118');
    await page.getByTestId('station-longitude').fill('-6.402');
    await page.getByTestId('station-elevation').fill('31');
    await page.getByTestId('station-barometer-height').fill('32.4');
    await page.getByTestId('station-time-zone').fill('Europe/London');
    // Typing in the next field closes the zone suggestions.
    await page.getByTestId('station-history').fill('Keeper kept the barograph in the watch room (invented).');
    await chooseOption(page, 'station-time-standard', 'UTC');
    await page.getByTestId('station-save').click();
    // The dialog closes only when the server stored the station; if it stays, its message says why.
    await page.getByTestId('station-save').waitFor({ state: 'detached' }).catch(async (error: unknown) => {
      throw new Error(`the station dialog stayed open: ${await page.locator('mat-dialog-container').innerText()}\n${String(error)}`);
    });
    const row = page.getByTestId('station-row').filter({ hasText: code });
    await row.waitFor();
    const rowText = await row.textContent();

    // Act 2: its barograph.
    await row.getByRole('link', { name: code }).click();
    await page.getByTestId('instrument-new').click();
    await waitForDialogReady(page);
    await page.getByTestId('instrument-serial').fill('B-2231');
    await page.getByTestId('instrument-maker').fill('Harlow & Pike');
    await page.getByTestId('instrument-installed').fill('1928-05-01');
    await page.getByTestId('instrument-save').click();
    const instrument = page.getByTestId('instrument-row').filter({ hasText: 'B-2231' });
    await instrument.waitFor();
    const instrumentText = await instrument.textContent();

    // Act 3: a daily chart form; the preview follows the numbers.
    await page.getByTestId('archive-tab-chart-forms').click();
    await page.getByTestId('chart-form-new').click();
    await page.getByTestId('cf-name').fill(`Daily 960–1050 hPa ${code}`);
    await page.getByTestId('cf-min').fill('960');
    await page.getByTestId('cf-drum-hours').fill('26');
    await page.getByTestId('cf-mm-per-hour').fill('10');
    await page.getByTestId('cf-label-hours').fill('2');
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="chart-grid-svg"] text').length === 10 + 14);
    const labels = await page.locator('[data-testid="chart-grid-svg"] text').allTextContents();
    await page.getByTestId('cf-save').click();
    await page.waitForURL(/\/archive\/chart-forms\/[0-9a-f-]{36}$/);

    // Act 4: the form the demo scans use.
    await page.getByTestId('archive-tab-chart-forms').click();
    await page.getByTestId('chart-form-row').filter({ hasText: 'Generated weekly 950–1050 hPa' }).getByRole('link').click();
    await page.getByTestId('chart-form-locked').waitFor();

    // Assert: the registers hold what was typed; the grid has a label every 10 hPa (960…1050) and every 2 h (0…26).
    expect(rowText).toContain('Glenmarrow Lighthouse');
    expect(rowText).toContain('0-20000-0-99871');
    expect(rowText).toContain('32.4');
    expect(rowText).toContain('UTC');
    expect(instrumentText).toContain('Harlow & Pike');
    expect(instrumentText).toContain('1928-05-01');
    expect(labels.slice(0, 10)).toEqual(['960', '970', '980', '990', '1000', '1010', '1020', '1030', '1040', '1050']);
    expect(labels.slice(10)).toEqual(['day 1', '2h', '4h', '6h', '8h', '10h', '12h', '14h', '16h', '18h', '20h', '22h', 'day 2', '2h']);
    expect(await page.getByTestId('cf-save').count()).toBe(0);
    await page.close();
  });
});
