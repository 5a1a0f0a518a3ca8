/// <reference lib="dom" />
/**
 * Bulk cataloguing through the real UI: an archivist takes in three scans (two with a date in the file name),
 * opens the intake batch in the catalogue, selects the whole batch, sets station, box and a tag for all and
 * the chart start from the file names by a pattern, checks the preview, and applies. The stored scans are read
 * back through the API. File names and station are the demo's invented ones.
 */
import { rmSync } from 'node:fs';
import type { IntakeBatch } from '@shared/api/intake';
import type { Page } from '@shared/api/paging';
import type { ScanDetail, ScanSummary } from '@shared/api/scans';
import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';
import type { RunningServer } from '../../server/server';
import { apiCall, tokenFor } from '../helpers/api-client';
import { chooseOption, launchChromium, signIn, type BrowserSession } from '../helpers/browser';
import { startE2eServer } from '../helpers/e2e-server';
import { makePng } from '../helpers/images';

jest.setTimeout(180_000);

async function upload(baseUrl: string, token: string, batchId: string, name: string): Promise<void> {
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(await makePng(300, 120))], { type: 'image/png' }), name);
  const response = await fetch(`${baseUrl}/api/intake/batches/${batchId}/files`, { method: 'POST', headers: { Authorization: `Bearer ${token}` }, body: form });
  if (response.status !== 201) throw new Error(`upload of ${name} answered ${response.status}: ${await response.text()}`);
}

describe('bulk cataloguing in the catalogue', () => {
  let workDir: string;
  let server: RunningServer;
  let chromium: BrowserSession;

  beforeAll(async () => {
    ({ server, workDir } = await startE2eServer('bulk-edit'));
    chromium = await launchChromium();
  });

  afterAll(async () => {
    await chromium?.close();
    await server?.close();
    rmSync(workDir, { recursive: true, force: true });
  });

  it('when an archivist selects a whole batch and sets fields and a file-name pattern, then every scan is stored with them after a preview', async () => {
    // Arrange: a batch of three scans, two named with their chart's date.
    const token = await tokenFor(server.url, 'archivist@isallo.test');
    const batch = await apiCall<IntakeBatch>(server.url, token, '/api/intake/batches', { method: 'POST', body: JSON.stringify({ label: 'Box 22, spring 1931' }) });
    for (const name of ['KRO_1931-04-06_w14.png', 'KRO_1931-04-13_w15.png', 'cover-sheet.png']) await upload(server.url, token, batch.id, name);
    const page = await chromium.browser.newPage({ viewport: { width: 1440, height: 950 } });
    await signIn(page, server.url, 'archivist@isallo.test', DEMO_PASSWORD);

    // Act: the batch in the catalogue, all of it selected, fields set, the pattern previewed, applied.
    await page.goto(`${server.url}/archive?batchId=${batch.id}`);
    await page.getByTestId('catalogue-row').first().waitFor();
    await page.getByTestId('catalogue-select-batch').click();
    await page.getByTestId('bulk-edit-panel').waitFor();
    await chooseOption(page, 'bulk-station', 'Kestrel Ridge');
    await page.getByTestId('bulk-box').fill('22');
    await page.getByTestId('bulk-tags').fill('spring 1931, bulk');
    await page.getByTestId('bulk-pattern').fill('KRO_{yyyy}-{MM}-{dd}');
    await page.getByTestId('bulk-matched').waitFor();
    const preview = await page.getByTestId('bulk-preview-row').allInnerTexts();
    const matched = await page.getByTestId('bulk-matched').innerText();
    await page.getByTestId('bulk-apply').click();
    await page.getByTestId('bulk-edit-panel').waitFor({ state: 'detached' });

    // Assert: the preview showed each file's reading, and the server holds the fields.
    expect(preview.map((row) => row.replace(/\s+/g, ' ').trim()).sort()).toEqual([
      'KRO_1931-04-06_w14.png 1931-04-06 00:00',
      'KRO_1931-04-13_w15.png 1931-04-13 00:00',
      'cover-sheet.png no match: left as is',
    ]);
    expect(matched).toBe('2 of 3 file names match.');
    const listed = await apiCall<Page<ScanSummary>>(server.url, token, `/api/scans?batchId=${batch.id}&sort=originalName&direction=asc`);
    const stored = await Promise.all(listed.items.map((scan) => apiCall<ScanDetail>(server.url, token, `/api/scans/${scan.id}`)));
    expect(stored.map((scan) => [scan.originalName, scan.stationName, scan.box, scan.tags, scan.chartStart])).toEqual([
      ['KRO_1931-04-06_w14.png', 'Kestrel Ridge Observatory', '22', ['spring 1931', 'bulk'], '1931-04-06T00:00:00.000Z'],
      ['KRO_1931-04-13_w15.png', 'Kestrel Ridge Observatory', '22', ['spring 1931', 'bulk'], '1931-04-13T00:00:00.000Z'],
      ['cover-sheet.png', 'Kestrel Ridge Observatory', '22', ['spring 1931', 'bulk'], null],
    ]);
    await page.close();
  });
});
