/**
 * The Bench, whole: a volunteer takes a generated chart with clock and instrument error from the Desk through
 * Pin, Ink, Marks and Proof to Hand in, with a reload in the middle that must lose nothing. The stored series
 * is checked against the generator's truth, and the clicks and keystrokes the volunteer needed are printed.
 * The chart is invented by fixtures/generator, so the true pressure at every hour is known.
 */
import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { paperHoursFor } from '../../fixtures/generator/chart-scene';
import { generateChart } from '../../fixtures/generator/generate-chart';
import { pixelFromReading } from '../../fixtures/generator/sheet-layout';
import { parseTruthCsv, scoreSeries } from '../../scripts/digitize/truth-comparison';
import { createDb } from '../../server/db/create-db';
import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';
import type { RunningServer } from '../../server/server';
import { chooseOption, launchChromium, signIn, signOut, type BrowserSession } from '../helpers/browser';
import { putScanFirstInQueue } from '../helpers/api-client';
import { startE2eServer } from '../helpers/e2e-server';
import { readStageView, toScreen } from '../helpers/stage-view';

const CHART_START = '2026-05-04T00:00:00Z';
const INSTRUMENT = { clockOffsetMinutes: 25, clockDriftMinutesPerDay: 5, instrumentOffsetHpa: 1.2 };
// The benchmark's bar for a clean weekly chart (scripts/digitize/digitize-chart.spec.ts, issue 3 §5): RMSE ≤ 0.15 hPa;
// here the pins are clicked on screen and the line comes from Follow ink's knots, so the degraded bar (0.35 hPa) holds.
const RMSE_BAR_HPA = 0.35;

jest.setTimeout(300_000);

/** Counts what the volunteer does: one per click or key press, one per character typed. */
class Effort {
  clicks = 0;
  keystrokes = 0;
  constructor(private readonly page: Page) {}
  async click(testId: string): Promise<void> {
    this.clicks++;
    await this.page.getByTestId(testId).click();
  }
  async clickAt(point: { x: number; y: number }): Promise<void> {
    this.clicks++;
    await this.page.mouse.click(point.x, point.y);
  }
  async type(testId: string, text: string, nth = 0): Promise<void> {
    this.keystrokes += text.length;
    await this.page.getByTestId(testId).nth(nth).fill(text);
  }
  async press(key: string): Promise<void> {
    this.keystrokes++;
    await this.page.keyboard.press(key);
  }
}

const typed = (iso: string) => `${iso.slice(0, 10)} ${iso.slice(11, 16)}`;

describe('the Bench, whole', () => {
  let workDir: string;
  let databaseUrl: string;
  let server: RunningServer;
  let chromium: BrowserSession;

  beforeAll(async () => {
    ({ server, workDir, databaseUrl } = await startE2eServer('bench-whole', { withWorker: true }));
    chromium = await launchChromium();
  });

  afterAll(async () => {
    await chromium?.close();
    await server?.close();
    rmSync(workDir, { recursive: true, force: true });
  });

  it('when a volunteer takes a chart with clock and instrument error from the Desk to Hand in, then the stored series is corrected to the truth', async () => {
    // Arrange: an invented weekly chart whose drum runs 25 min fast, gaining 5 min a day, and whose pen reads 1.2 hPa high.
    const chart = await generateChart({ seed: 41, dpi: 150, chartStart: CHART_START, instrument: INSTRUMENT });
    const scanPath = join(workDir, 'saltmere-week-19.png');
    writeFileSync(scanPath, chart.image);
    const json = chart.chartJson as {
      pins: { xPx: number; yPx: number; time: string; pressure: number }[];
      chartOn: string;
      chartOff: string;
      timeMarks: { time: string }[];
      checkReadings: { time: string; pressureHpa: number }[];
    };
    const markFeet = chart.scene.timeMarkHours.map((h) =>
      pixelFromReading(chart.layout, { hours: paperHoursFor(h, INSTRUMENT), pressure: chart.scene.story.pressureHpaAt(h) + INSTRUMENT.instrumentOffsetHpa }),
    );
    const page = await chromium.browser.newPage({ viewport: { width: 1500, height: 950 } });
    await signIn(page, server.url, 'archivist@isallo.test', DEMO_PASSWORD);
    await page.getByTestId('nav-archive').click();
    await page.getByTestId('archive-tab-intake').click();
    await page.getByTestId('upload-file').setInputFiles(scanPath);
    await chooseOption(page, 'upload-station', 'Saltmere Bay School');
    await chooseOption(page, 'upload-chart-form', 'Generated weekly 950–1050 hPa');
    await page.getByTestId('upload-chart-start').fill('2026-05-04T00:00Z');
    await page.getByTestId('upload-submit').click();
    await page.getByTestId('upload-result').filter({ hasText: /stored/i }).waitFor();
    await signOut(page);
    const scanId = await putScanFirstInQueue(server.url, 'Saltmere Bay School');
    await signIn(page, server.url, 'volunteer@isallo.test', DEMO_PASSWORD);
    await page.getByTestId('nav-desk').click();
    const effort = new Effort(page);

    // Act 1, Pin: Next chart claims it, then four crossings; each comes pre-filled from the printed lines, Enter saves.
    await page.getByTestId('next-chart').click();
    await page.locator(`[data-testid="desk-claim"][data-scan-id="${scanId}"]`).waitFor();
    await page.getByTestId('claim-open').click();
    effort.clicks += 2;
    await page.locator('[data-testid="scan-stage"][data-view-ready="true"]').waitFor();
    let view = await readStageView(page);
    for (const [index, pin] of json.pins.slice(0, 4).entries()) {
      await effort.clickAt(toScreen(view, pin));
      // The click is snapped to the printed crossing found in the scan, and says so.
      await page.getByTestId('pin-snapped').waitFor();
      await expectValue(page, 'pin-time', typed(pin.time));
      await expectValue(page, 'pin-pressure', String(pin.pressure));
      await effort.press('Enter');
      await expectCount(page, 'pin-row', index + 1);
      // The ghost grid comes with the third pin, and each pin then shows its residual; none of these is off.
      const gridLines = Number((await page.getByTestId('scan-stage').getAttribute('data-ghost-grid-lines')) ?? 0);
      if (index < 2) expect(gridLines).toBe(0);
      else {
        await page.waitForFunction(() => Number(document.querySelector('[data-testid="scan-stage"]')?.getAttribute('data-ghost-grid-lines')) > 0);
        await expectCount(page, 'pin-residual', index + 1);
        expect(await page.locator('[data-testid="pin-residual"][data-outlier="true"]').count()).toBe(0);
      }
    }
    await page.locator('[data-testid="save-state"][data-state="saved"]').waitFor();

    // A reload loses nothing: the draft on the server comes back with its four pins.
    await page.reload();
    await page.locator('[data-testid="scan-stage"][data-view-ready="true"]').waitFor();
    await expectCount(page, 'pin-row', 4);
    await page.locator('[data-testid="save-state"][data-state="saved"]').waitFor();

    // The shortcuts' help opens with ? and closes with Esc (a look, not part of the volunteer's count).
    await page.keyboard.press('?');
    await page.getByTestId('shortcut-help').waitFor();
    expect(await page.getByTestId('shortcut-row').count()).toBeGreaterThan(10);
    await page.keyboard.press('Escape');
    await page.getByTestId('shortcut-help').waitFor({ state: 'detached' });

    // Act 2, Ink: Follow ink finds the line.
    await effort.click('mode-ink');
    await effort.click('follow-ink');
    await page.getByTestId('follow-ink-result').waitFor();

    const beforeMarks = effort.clicks + effort.keystrokes;
    // Act 3, Marks: each time mark's foot and its true time, chart on / chart off, one check reading per mark.
    view = await readStageView(page);
    await effort.click('mode-marks');
    for (const foot of markFeet) await effort.clickAt(toScreen(view, foot));
    await expectCount(page, 'time-mark-row', markFeet.length);
    for (let i = 0; i < json.timeMarks.length; i++) {
      await effort.type('time-mark-time', typed(json.timeMarks[i].time), i);
      await effort.press('Tab');
    }
    await effort.type('chart-on', typed(json.chartOn));
    await effort.press('Tab');
    await effort.type('chart-off', typed(json.chartOff));
    await effort.press('Tab');
    for (const reading of json.checkReadings) {
      await effort.type('check-time', typed(reading.time));
      await effort.type('check-pressure', String(reading.pressureHpa));
      await effort.press('Enter');
    }
    await expectCount(page, 'check-row', json.checkReadings.length);

    const inMarks = effort.clicks + effort.keystrokes - beforeMarks;
    // Act 4, Proof and Hand in.
    await effort.click('mode-proof');
    await page.getByTestId('proof-checklist').waitFor();
    await effort.click('hand-in');
    const result = page.getByTestId('hand-in-result');
    await result.waitFor();
    const clockText = await page.getByTestId('hand-in-clock').innerText();
    const instrumentText = await page.getByTestId('hand-in-instrument').innerText();
    const total = effort.clicks + effort.keystrokes;
    console.log(`Bench effort, Desk to Hand in: ${effort.clicks} clicks + ${effort.keystrokes} keystrokes = ${total} (Marks step ${inMarks}, the rest ${total - inMarks})`);

    // Assert: the stored series of the volunteer's line, against the generator's truth.
    const db = createDb(databaseUrl, 1);
    try {
      const line = await db
        .selectFrom('ink_line')
        .innerJoin('scan', 'scan.id', 'ink_line.scan_id')
        .select(['ink_line.id', 'ink_line.status', 'ink_line.work'])
        .where('scan.original_name', '=', 'saltmere-week-19.png')
        .executeTakeFirstOrThrow();
      const points = await db.selectFrom('series_point').selectAll().where('ink_line_id', '=', line.id).orderBy('time').execute();
      const score = scoreSeries(
        points.map((p) => ({ timeMs: p.time.getTime(), pressureHpa: p.pressure_hpa, flag: p.flag, uncertaintyHpa: p.uncertainty_hpa })),
        parseTruthCsv(chart.truthCsv),
      );
      console.log(`Bench hand-in: ${points.length} points, RMSE ${score.rmseHpa.toFixed(3)} hPa against the truth; ${clockText}; ${instrumentText}`);
      // Snapped pins sit on the printed crossings to a fraction of a pixel, though a click lands only to a screen pixel (≈ 1.7 scan px here).
      const pinMissesPx = (line.work.pins ?? []).map((stored, i) => Math.hypot(stored.xPx - json.pins[i].xPx, stored.yPx - json.pins[i].yPx));
      console.log(`Bench pins: snapped ${pinMissesPx.map((miss) => miss.toFixed(2)).join(', ')} px from the true crossings`);
      expect(pinMissesPx).toHaveLength(4);
      expect(Math.max(...pinMissesPx)).toBeLessThan(0.5);
      expect(line.status).toBe('handed_in');
      expect(line.work.timeMarks).toHaveLength(markFeet.length);
      expect(clockText).not.toMatch(/not corrected/);
      expect(instrumentText).not.toMatch(/not corrected/);
      expect(score.comparedPoints).toBeGreaterThan(100);
      expect(score.rmseHpa).toBeLessThanOrEqual(RMSE_BAR_HPA);
    } finally {
      await db.destroy();
    }

    // A second visit opens the chart read-only.
    await page.reload();
    await page.locator('[data-testid="save-state"][data-state="handed_in"]').waitFor();
    expect(await page.getByTestId('hand-in').isDisabled()).toBe(true);
    await page.close();
  });
});

/** Waits until the field shows the value (the Pin step fills it in a render after the click). */
async function expectValue(page: Page, testId: string, value: string): Promise<void> {
  await page.waitForFunction(
    ([id, expected]) => (document.querySelector(`[data-testid="${id}"]`) as HTMLInputElement | null)?.value === expected,
    [testId, value] as const,
    { timeout: 5_000 },
  );
}

async function expectCount(page: Page, testId: string, count: number): Promise<void> {
  await page.waitForFunction(([id, n]) => document.querySelectorAll(`[data-testid="${id}"]`).length === n, [testId, count] as const);
}
