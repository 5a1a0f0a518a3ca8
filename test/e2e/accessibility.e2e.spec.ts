/// <reference lib="dom" />
/**
 * Every page of every role's navigation through axe-core: each demo account signs in, opens each area and
 * tab of its navigation and the first detail page each list leads to, and the page must show no serious or
 * critical violation of the WCAG 2 A and AA rules (axe-core's rule set, run from npm inside the page). The
 * sign-in page is checked before anyone signs in, and its empty fields must not be marked before a submit.
 */
import { rmSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';
import type { RunningServer } from '../../server/server';
import { seriousAxeViolations } from '../helpers/axe';
import { launchChromium, signIn, signOut, type BrowserSession } from '../helpers/browser';
import { startE2eServer } from '../helpers/e2e-server';

jest.setTimeout(600_000);

/** One page to check: how to reach it from the signed-in shell and what shows once it has loaded. */
interface PageVisit {
  name: string;
  open: (page: Page, baseUrl: string) => Promise<void>;
  /** A selector that is on screen once the page has drawn its content. */
  ready: string;
}

const goTo = (path: string) => async (page: Page, baseUrl: string) => {
  await page.goto(`${baseUrl}${path}`);
};
/** Opens the first link of the first row of a list page. */
const firstOf = (path: string, rowTestId: string, link = 'a') => async (page: Page, baseUrl: string) => {
  await page.goto(`${baseUrl}${path}`);
  await page.getByTestId(rowTestId).first().locator(link).first().click();
};

/** The volunteer's way to the Bench: Next chart claims the queue's first chart, then the claim opens it. */
const claimNextChart = async (page: Page, baseUrl: string) => {
  await page.goto(`${baseUrl}/desk`);
  await page.getByTestId('next-chart').click();
  await page.getByTestId('claim-open').click();
};

const VISITS: Record<string, PageVisit[]> = {
  'archivist@isallo.test': [
    { name: 'catalogue', open: goTo('/archive'), ready: '[data-testid="catalogue-row"]' },
    { name: 'scan page', open: firstOf('/archive', 'catalogue-row', '[data-testid="catalogue-open"]'), ready: '[data-testid="scan-facts"]' },
    { name: 'intake', open: goTo('/archive/intake'), ready: 'main h1' },
    { name: 'stations', open: goTo('/archive/stations'), ready: '[data-testid="station-row"]' },
    { name: 'station page', open: firstOf('/archive/stations', 'station-row'), ready: 'main h1' },
    { name: 'chart forms', open: goTo('/archive/chart-forms'), ready: '[data-testid="chart-form-row"]' },
    { name: 'chart form page', open: firstOf('/archive/chart-forms', 'chart-form-row'), ready: 'main h1' },
    { name: 'new chart form', open: goTo('/archive/chart-forms/new'), ready: 'main h1' },
    // The demo keeps one handed-in line waiting for review.
    { name: 'review', open: goTo('/archive/review'), ready: '[data-testid="review-row"]' },
    { name: 'review page', open: firstOf('/archive/review', 'review-row', '[data-testid="review-open"]'), ready: '[data-testid="review-ghost-grid"]' },
  ],
  'volunteer@isallo.test': [
    { name: 'desk', open: goTo('/desk'), ready: '[data-testid="next-chart"]' },
    { name: 'bench', open: claimNextChart, ready: '[data-testid="scan-stage"] canvas' },
  ],
  'climatologist@isallo.test': [{ name: 'series', open: goTo('/series'), ready: '[data-testid="series-station"]' }],
  'teacher@isallo.test': [
    { name: 'lessons', open: goTo('/lessons'), ready: '[data-testid="lesson-new"]' },
    { name: 'new lesson', open: goTo('/lessons/new'), ready: 'main h1' },
    { name: 'series', open: goTo('/series'), ready: '[data-testid="series-station"]' },
  ],
  'admin@isallo.test': [{ name: 'people', open: goTo('/people'), ready: '[data-testid="person-row"]' }],
};

describe('accessibility of every page, for each role', () => {
  let workDir: string;
  let server: RunningServer;
  let chromium: BrowserSession;
  let page: Page;

  beforeAll(async () => {
    // The worker makes the demo scans' derivatives, so the scan page and the Bench show their images.
    ({ server, workDir } = await startE2eServer('accessibility', { withWorker: true }));
    chromium = await launchChromium();
    page = await chromium.browser.newPage({ viewport: { width: 1400, height: 900 } });
  });

  afterAll(async () => {
    await chromium?.close();
    await server?.close();
    if (workDir) rmSync(workDir, { recursive: true, force: true });
  });

  it('when the sign-in page opens and someone tabs past its empty fields, then it has a heading, no field is marked and axe finds nothing serious', async () => {
    await page.goto(`${server.url}/sign-in`);
    await page.getByTestId('email').focus();
    await page.keyboard.press('Tab');
    await page.keyboard.press('Tab');

    const headings = await page.locator('h1').allTextContents();
    const invalidBeforeSubmit = await page.locator('.mat-form-field-invalid').count();
    await page.getByTestId('sign-in').click();
    const invalidAfterSubmit = await page.locator('.mat-form-field-invalid').count();

    expect(headings).toEqual(['Isallo']);
    expect(invalidBeforeSubmit).toBe(0);
    expect(invalidAfterSubmit).toBe(2);
    expect(await seriousAxeViolations(page)).toEqual([]);
  });

  it.each(Object.keys(VISITS))('when %s visits each page of their navigation, then axe finds no serious or critical violation', async (email) => {
    await signIn(page, server.url, email, DEMO_PASSWORD);
    const found: Record<string, string[]> = {};

    for (const visit of VISITS[email]) {
      await visit.open(page, server.url);
      // In the DOM is enough for axe (the Bench's stage may still be waiting for the worker's preview).
      await page.locator(visit.ready).first().waitFor({ state: 'attached', timeout: 60_000 });
      await page.locator('main').waitFor();
      found[visit.name] = await seriousAxeViolations(page);
    }
    // From a fresh load, the first tab stop is the skip link, not Sign out.
    await page.reload();
    await page.locator('main').waitFor();
    await page.keyboard.press('Tab');
    const firstFocused = await page.evaluate(() => document.activeElement?.getAttribute('data-testid') ?? document.activeElement?.tagName ?? null);
    await signOut(page);

    expect(found).toEqual(Object.fromEntries(VISITS[email].map((visit) => [visit.name, []])));
    expect(firstFocused).toBe('skip-to-main');
  });
});
