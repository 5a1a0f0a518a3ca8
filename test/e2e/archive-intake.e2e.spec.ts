/// <reference lib="dom" />
/**
 * The archivist's day through the real UI: a folder of mixed files (PNG, JPEG, a three-page TIFF, a two-page
 * PDF, a text file renamed .png, a second copy of the PNG) and the box inventory go through Intake to a
 * batch summary, the inventory fills the scans' metadata, the catalogue is filtered by station, date range
 * and status, and one scan opens in the close view with its chart form's grid laid over it. Every file is made
 * here at test time (sharp and a hand-written PDF); stations, boxes and dates are invented.
 */
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import sharp from 'sharp';
import { generateChart } from '../../fixtures/generator/generate-chart';
import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';
import type { RunningServer } from '../../server/server';
import { startE2eServer } from '../helpers/e2e-server';
import { chooseOption, launchChromium, signIn, type BrowserSession } from '../helpers/browser';
import { pollUntil } from '../helpers/poll-until';


jest.setTimeout(300_000);

/** A PDF of `pageCount` landscape pages, each ruled with a grid and a pen line, written object by object. */
function handWrittenPdf(pageCount: number): Buffer {
  const objects: string[] = [];
  const pageIds = Array.from({ length: pageCount }, (_, i) => 3 + i * 2);
  objects.push('<< /Type /Catalog /Pages 2 0 R >>');
  objects.push(`<< /Type /Pages /Kids [${pageIds.map((id) => `${id} 0 R`).join(' ')}] /Count ${pageCount} >>`);
  for (let page = 0; page < pageCount; page++) {
    const lines: string[] = ['0.85 0.45 0.2 RG 0.4 w'];
    for (let x = 36; x <= 756; x += 24) lines.push(`${x} 36 m ${x} 252 l S`);
    for (let y = 36; y <= 252; y += 18) lines.push(`36 ${y} m 756 ${y} l S`);
    lines.push('0.1 0.2 0.6 RG 1.2 w 36 150 m');
    for (let x = 60; x <= 756; x += 24) lines.push(`${x} ${150 + Math.round(40 * Math.sin((x + page * 90) / 70))} l`);
    lines.push('S');
    const stream = lines.join('\n');
    objects.push(`<< /Type /Page /Parent 2 0 R /MediaBox [0 0 792 288] /Contents ${pageIds[page] + 1} 0 R /Resources << >> >>`);
    objects.push(`<< /Length ${Buffer.byteLength(stream, 'latin1')} >>\nstream\n${stream}\nendstream`);
  }
  let body = '%PDF-1.4\n';
  const offsets: number[] = [];
  objects.forEach((object, i) => {
    offsets.push(Buffer.byteLength(body, 'latin1'));
    body += `${i + 1} 0 obj\n${object}\nendobj\n`;
  });
  const xrefAt = Buffer.byteLength(body, 'latin1');
  body += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n`;
  for (const offset of offsets) body += `${String(offset).padStart(10, '0')} 00000 n \n`;
  body += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xrefAt}\n%%EOF\n`;
  return Buffer.from(body, 'latin1');
}

/** A TIFF with one page per shade: stands for a scanner's multi-page output. */
async function multiPageTiff(pageCount: number): Promise<Buffer> {
  const pages = await Promise.all(
    Array.from({ length: pageCount }, (_, i) =>
      sharp({ create: { width: 900, height: 360, channels: 3, background: { r: 236 - i * 12, g: 228, b: 208 } } })
        .composite([{ input: Buffer.from(`<svg width="900" height="360"><path d="M20 ${180 + i * 20} C300 90 600 270 880 ${150 + i * 10}" stroke="#1d4ed8" stroke-width="3" fill="none"/></svg>`) }])
        .png()
        .toBuffer(),
    ),
  );
  return sharp(pages, { join: { animated: true } }).tiff({ compression: 'lzw' }).toBuffer();
}

interface Folder {
  dir: string;
  files: string[];
}

async function writeBoxFolder(workDir: string): Promise<Folder> {
  const dir = join(workDir, 'box-14');
  const week10 = await generateChart({ seed: 31, dpi: 150, chartStart: '2026-04-06T00:00:00Z' });
  const week11 = await generateChart({ seed: 32, dpi: 100, chartStart: '2026-04-13T00:00:00Z' });
  // The scanner writes its resolution into the file; the archive reads dpi from there.
  const png = await sharp(week10.image).withMetadata({ density: 150 }).png().toBuffer();
  const jpeg = await sharp(week11.image).jpeg({ quality: 85 }).toBuffer();
  const files: Record<string, Buffer> = {
    'kro-1931-w10.png': png,
    'second-copy-of-w10.png': png,
    'kro-1931-w09.jpg': jpeg,
    'kro-1931-w11-13.tif': await multiPageTiff(3),
    'kro-1931-log.pdf': handWrittenPdf(2),
    'box-notes.png': Buffer.from('Box 14: charts 7 to 12 were damp when received.\n'.repeat(40), 'utf8'),
    'box-14-inventory.csv': Buffer.from(
      [
        'file name,station,chart on,chart off,box,folder,notes',
        'kro-1931-w10.png,KRO,1931-03-02 09:00,1931-03-09 09:00,B14,F3,gale on the Thursday',
        'kro-1931-w11-13.tif,KRO,1931-03-09 09:00,1931-03-16 09:00,B14,F3,',
        'kro-1931-log.pdf,Kestrel Ridge Observatory,1931-03-16 09:00,1931-03-23 09:00,B14,F4,',
        'kro-1931-w15.png,KRO,1931-03-23 09:00,1931-03-30 09:00,B14,F4,listed but never scanned',
        '',
      ].join('\n'),
      'utf8',
    ),
  };
  mkdirSync(dir, { recursive: true });
  for (const [name, bytes] of Object.entries(files)) writeFileSync(join(dir, name), bytes);
  return { dir, files: Object.keys(files).map((name) => join(dir, name)) };
}

async function textOf(page: Page, testId: string): Promise<string> {
  return (await page.getByTestId(testId).first().textContent())?.trim() ?? '';
}

async function waitForRowCount(page: Page, count: number): Promise<void> {
  await page.waitForFunction((n) => document.querySelectorAll('[data-testid="catalogue-row"]').length === n, count, { timeout: 30_000 });
}

/** Waits (up to a minute, then fails) until no scan of the batch is queued or working. */
async function waitForBatchDerivatives(baseUrl: string, batchId: string): Promise<void> {
  const signIn = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: 'archivist@isallo.test', password: DEMO_PASSWORD }),
  });
  const { token } = (await signIn.json()) as { token: string };
  await pollUntil(
    async () => {
      const response = await fetch(`${baseUrl}/api/scans?batchId=${encodeURIComponent(batchId)}&pageSize=200`, { headers: { Authorization: `Bearer ${token}` } });
      return ((await response.json()) as { items: { derivativeState: string }[] }).items;
    },
    (scans) => scans.every((scan) => scan.derivativeState === 'ready' || scan.derivativeState === 'failed'),
    { timeoutMs: 60_000, intervalMs: 500, describe: (scans) => `batch derivatives still ${JSON.stringify(scans.map((scan) => scan.derivativeState))}` },
  );
}

describe('an intake batch from a folder to a searchable catalogue with the close view', () => {
  let workDir: string;
  let server: RunningServer;
  let chromium: BrowserSession;
  let batchIdSeen: string | null = null;

  beforeAll(async () => {
    ({ server, workDir } = await startE2eServer('intake', { withWorker: true }));
    chromium = await launchChromium();
  });

  afterAll(async () => {
    // The browser suites share one database: let this batch's derivative jobs finish here, so the next
    // suite's worker does not pick them up against a storage folder it does not have.
    if (server && batchIdSeen) await waitForBatchDerivatives(server.url, batchIdSeen);
    await chromium?.close();
    await server?.close();
    rmSync(workDir, { recursive: true, force: true });
  });

  it('when an archivist sends a box folder and its inventory, then the catalogue lists, filters and opens its scans in the close view', async () => {
    // Arrange: the folder as a scanner and an archivist would leave it.
    const folder = await writeBoxFolder(workDir);
    const page = await chromium.browser.newPage({ viewport: { width: 1500, height: 1000 } });
    const tileRequests: string[] = [];
    page.on('request', (request) => {
      if (/\/iiif\/3\/[^/]+\/[^/]+\/[^/]+\/0\/default\.jpg$/.test(new URL(request.url()).pathname)) tileRequests.push(request.url());
    });

    // Act 1: the files go through Intake, with one chart form for all of them.
    await signIn(page, server.url, 'archivist@isallo.test', DEMO_PASSWORD);
    await page.getByTestId('nav-archive').click();
    await page.getByTestId('archive-tab-intake').click();
    await page.getByTestId('intake-label').fill('Box 14, Kestrel Ridge 1931');
    await chooseOption(page, 'intake-chart-form', 'Generated weekly 950–1050 hPa');
    await page.getByTestId('intake-files').setInputFiles(folder.files);
    await page.getByTestId('intake-inventory-found').waitFor();
    await page.getByTestId('intake-start').click();
    await page.getByTestId('intake-summary').waitFor({ timeout: 120_000 });
    const itemStates = await page.getByTestId('intake-item').evaluateAll((items) => items.map((item) => [item.getAttribute('data-file-name'), item.getAttribute('data-state')]));

    // Assert 1: the batch summary counts each outcome and says why the fake PNG was refused.
    expect(Object.fromEntries(itemStates)).toEqual({
      'box-notes.png': 'rejected',
      'kro-1931-log.pdf': 'stored',
      'kro-1931-w09.jpg': 'stored',
      // Identical bytes travel one after the other (the intake queues them in one lane), so the copy is the duplicate.
      'second-copy-of-w10.png': 'duplicate',
      'kro-1931-w10.png': 'stored',
      'kro-1931-w11-13.tif': 'stored',
    });
    expect(await textOf(page, 'summary-stored')).toBe('4');
    expect(await textOf(page, 'summary-duplicate')).toBe('1');
    expect(await textOf(page, 'summary-rejected')).toBe('1');
    // One PNG, one JPEG, three TIFF pages, two PDF pages.
    expect(await textOf(page, 'summary-scans')).toBe('7');
    const rejectedRow = page.locator('[data-testid="summary-file"][data-outcome="rejected"]');
    expect(await rejectedRow.textContent()).toContain('box-notes.png');
    expect((await rejectedRow.locator('.reason').textContent())?.trim()).not.toBe('');

    // Act 2: the inventory found in the folder is imported.
    expect(await textOf(page, 'inventory-file-name')).toBe('box-14-inventory.csv');
    await page.getByTestId('inventory-import').click();
    await page.getByTestId('inventory-result').waitFor();

    // Assert 2: three rows matched, the unscanned week is listed, and the JPEG (no row) links to its scan.
    expect(await textOf(page, 'inventory-matched-count')).toBe('3');
    expect(await textOf(page, 'inventory-rows-without-file-count')).toBe('1');
    expect(await page.getByTestId('inventory-row-without-file').textContent()).toContain('kro-1931-w15.png');
    const withoutRow = await page.getByTestId('inventory-file-without-row').allTextContents();
    expect(withoutRow.some((text) => text.includes('kro-1931-w09.jpg'))).toBe(true);
    expect(await page.getByTestId('inventory-file-without-row').filter({ hasText: 'kro-1931-w09.jpg' }).getByTestId('inventory-fix-link').count()).toBe(1);

    // Act 3: the batch in the catalogue, then narrowed by station, by a date range and by status.
    await page.getByTestId('summary-catalogue-link').click();
    await waitForRowCount(page, 7);
    await chooseOption(page, 'filter-station', 'Kestrel Ridge Observatory');
    await waitForRowCount(page, 6);
    await page.getByTestId('filter-from').fill('1931-03-01');
    await page.getByTestId('filter-to').fill('1931-03-05');
    await waitForRowCount(page, 1);
    const onlyRow = await page.getByTestId('catalogue-row').first().textContent();
    const receivedCount = await page.locator('[data-testid="status-count"][data-status="received"] .number').textContent();
    const url = new URL(page.url());

    // Assert 3: the week of 2 March 1931 holds the PNG alone, and the address keeps every filter.
    expect(onlyRow).toContain('kro-1931-w10');
    expect(receivedCount?.trim()).toBe('1');
    expect(url.searchParams.get('from')).toBe('1931-03-01');
    expect(url.searchParams.get('to')).toBe('1931-03-05');
    expect(url.searchParams.get('batchId')).not.toBeNull();
    batchIdSeen = url.searchParams.get('batchId');
    expect(url.searchParams.get('stationId')).not.toBeNull();

    // Act 3b: the days cleared, a word from the inventory's notes finds its chart.
    await page.getByTestId('filter-from').fill('');
    await page.getByTestId('filter-to').fill('');
    await waitForRowCount(page, 6);
    await page.getByTestId('filter-q').fill('gale');
    await waitForRowCount(page, 1);

    // Assert 3b: free text searches what the inventory wrote.
    expect(await page.getByTestId('catalogue-row').first().textContent()).toContain('kro-1931-w10.png');
    expect(new URL(page.url()).searchParams.get('q')).toBe('gale');

    // Act 4: that scan opens in the close view once the worker has made its tiles, with the chart form's grid over it.
    await page.getByTestId('catalogue-row').first().getByTestId('catalogue-open').click();
    await page.locator('[data-testid="derivative-state"][data-state="ready"]').waitFor({ timeout: 120_000 });
    await page.locator('[data-testid="close-view"][data-open="true"]').waitFor({ timeout: 60_000 });
    await page.waitForFunction(() => Number(document.querySelector('[data-testid="close-view"]')?.getAttribute('data-tiles-drawn') ?? 0) > 0, null, { timeout: 60_000 });
    const paintedShare = await page.evaluate(() => {
      const canvas = document.querySelector<HTMLCanvasElement>('[data-testid="close-view"] canvas');
      const context = canvas?.getContext('2d');
      if (!canvas || !context) return 0;
      const { data } = context.getImageData(0, 0, canvas.width, canvas.height);
      let painted = 0;
      for (let i = 3; i < data.length; i += 4) if (data[i] > 0) painted++;
      return painted / (canvas.width * canvas.height);
    });
    await page.getByTestId('grid-toggle').click();
    await page.locator('[data-testid="grid-overlay"].is-active svg path').first().waitFor();
    const gridBox = await page.getByTestId('grid-overlay').boundingBox();

    // Assert 4: tiles came through IIIF, the canvas drew the scan, and the grid sits over it.
    expect(tileRequests.length).toBeGreaterThan(0);
    expect(paintedShare).toBeGreaterThan(0.2);
    expect(gridBox?.width ?? 0).toBeGreaterThan(100);
    expect(await page.getByTestId('scan-metadata-form').getByTestId('meta-box').inputValue()).toBe('B14');
    await page.close();
  });
});
