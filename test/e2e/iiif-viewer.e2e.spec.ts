/// <reference lib="dom" />
/**
 * Interoperability: a general-purpose IIIF viewer from npm (OpenSeadragon 5) opens a scan's Image API 3.0
 * info.json, and the image service named in the scan's Presentation 3.0 manifest, in headless Chromium,
 * requests tiles with the bearer token and draws them. Nothing of Isallo's client runs here: the viewer is
 * loaded on its own into a blank page of the server's origin, as another site's viewer would use it.
 */
import { rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import sharp from 'sharp';
import type { SignInResponse } from '@shared/api/auth';
import type { IntakeBatch, IntakeFileResult } from '@shared/api/intake';
import type { ScanDetail } from '@shared/api/scans';
import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';
import type { RunningServer } from '../../server/server';
import { startE2eServer } from '../helpers/e2e-server';
import { launchChromium, type BrowserSession } from '../helpers/browser';
import { pollUntil } from '../helpers/poll-until';

const ROOT = resolve(__dirname, '../..');
const OPENSEADRAGON = join(ROOT, 'node_modules/openseadragon/build/openseadragon/openseadragon.min.js');

jest.setTimeout(240_000);

/** The parts of a Presentation 3.0 manifest this test reads. */
interface ManifestSketch {
  type: string;
  metadata: { label: Record<string, string[]>; value: Record<string, string[]> }[];
  items: {
    type: string;
    width: number;
    height: number;
    items: { items: { motivation: string; body: { service: ServiceSketch | ServiceSketch[] } }[] }[];
  }[];
}

interface ServiceSketch {
  id?: string;
  '@id'?: string;
  type: string;
}

interface ViewerReport {
  opened: boolean;
  tilesDrawn: number;
  paintedShare: number;
  failure: string | null;
}

/** A scan large enough for several 512 px tiles at full size: a ruled sheet with a pen line. */
async function ruledSheet(): Promise<Buffer> {
  const width = 2200;
  const height = 900;
  const lines: string[] = [];
  for (let x = 50; x < width; x += 40) lines.push(`<path d="M${x} 40V${height - 40}" stroke="#c2410c" stroke-width="1"/>`);
  for (let y = 40; y < height; y += 30) lines.push(`<path d="M50 ${y}H${width - 50}" stroke="#c2410c" stroke-width="1"/>`);
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}"><rect width="100%" height="100%" fill="#f3ead8"/>${lines.join('')}<path d="M50 450 C600 200 1200 700 2150 380" stroke="#0e7490" stroke-width="4" fill="none"/></svg>`;
  return sharp(Buffer.from(svg)).png().toBuffer();
}

async function api<T>(baseUrl: string, path: string, init: RequestInit & { token?: string } = {}): Promise<{ status: number; body: T }> {
  const headers = new Headers(init.headers);
  if (init.token) headers.set('Authorization', `Bearer ${init.token}`);
  const response = await fetch(`${baseUrl}${path}`, { ...init, headers });
  return { status: response.status, body: (await response.json()) as T };
}

/**
 * Opens an info.json in OpenSeadragon inside the page and reports once tiles are drawn (or the open fails).
 * OpenSeadragon 5.0 sends `ajaxHeaders` with every tile but not with the info.json request of a URL tile
 * source (seen in Chromium against a header-logging server), so the page fetches the info document with the
 * token and hands it over, as any viewer of a protected IIIF service does; the tiles it then asks for itself.
 */
async function openInViewer(page: Page, infoUrl: string, token: string): Promise<ViewerReport> {
  return page.evaluate(
    ({ infoUrl, token }) =>
      new Promise<ViewerReport>(async (resolve) => {
        const infoResponse = await fetch(infoUrl, { headers: { Authorization: `Bearer ${token}` } });
        if (!infoResponse.ok) {
          resolve({ opened: false, tilesDrawn: 0, paintedShare: 0, failure: `info.json answered ${infoResponse.status}` });
          return;
        }
        const tileSource = await infoResponse.json();
        document.body.innerHTML = '';
        const element = document.createElement('div');
        element.style.cssText = 'width:900px;height:500px;background:#000';
        document.body.appendChild(element);
        const OSD = (window as unknown as { OpenSeadragon: (options: Record<string, unknown>) => any }).OpenSeadragon;
        const viewer = OSD({
          element,
          tileSources: tileSource,
          loadTilesWithAjax: true,
          ajaxHeaders: { Authorization: `Bearer ${token}` },
          drawer: 'canvas',
          showNavigationControl: false,
          animationTime: 0,
        });
        let opened = false;
        let tilesDrawn = 0;
        const report = (failure: string | null) => {
          const canvas = element.querySelector('canvas');
          const context = canvas?.getContext('2d');
          let painted = 0;
          if (canvas && context) {
            const { data } = context.getImageData(0, 0, canvas.width, canvas.height);
            for (let i = 0; i < data.length; i += 4) if (data[i] + data[i + 1] + data[i + 2] > 60) painted++;
          }
          resolve({ opened, tilesDrawn, paintedShare: canvas ? painted / (canvas.width * canvas.height) : 0, failure });
        };
        viewer.addHandler('open', () => (opened = true));
        viewer.addHandler('open-failed', (event: { message?: string }) => report(event.message ?? 'open failed'));
        viewer.addHandler('tile-drawn', () => (tilesDrawn += 1));
        // Fully loaded: every tile the view needs has arrived and been drawn.
        viewer.world.addHandler('add-item', (event: { item: { addOnceHandler: (name: string, handler: () => void) => void } }) =>
          event.item.addOnceHandler('fully-loaded-change', () => setTimeout(() => report(null), 200)),
        );
        setTimeout(() => report('timed out'), 60_000);
      }),
    { infoUrl, token },
  );
}

describe('a general-purpose IIIF viewer reads the archive', () => {
  let workDir: string;
  let server: RunningServer;
  let chromium: BrowserSession;
  let context: BrowserContext;
  let token: string;
  let scan: ScanDetail;

  beforeAll(async () => {
    ({ server, workDir } = await startE2eServer('iiif', { withWorker: true }));
    chromium = await launchChromium();
    // The viewer's script goes into a blank page of the server's origin; the app's CSP is for the app's own pages.
    context = await chromium.browser.newContext({ bypassCSP: true, viewport: { width: 1000, height: 700 } });

    const signIn = await api<SignInResponse>(server.url, '/api/auth/sign-in', {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: 'archivist@isallo.test', password: DEMO_PASSWORD }),
    });
    token = signIn.body.token;
    const batch = await api<IntakeBatch>(server.url, '/api/intake/batches', {
      method: 'POST',
      token,
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ label: 'IIIF viewer check' }),
    });
    const form = new FormData();
    form.append('file', new Blob([new Uint8Array(await ruledSheet())], { type: 'image/png' }), 'ruled-sheet.png');
    const sent = await api<IntakeFileResult>(server.url, `/api/intake/batches/${batch.body.id}/files`, { method: 'POST', token, body: form });
    if (sent.status !== 201) throw new Error(`upload answered ${sent.status}: ${JSON.stringify(sent.body)}`);
    const scanId = sent.body.scans[0].id;
    scan = await pollUntil(
      async () => (await api<ScanDetail>(server.url, `/api/scans/${scanId}`, { token })).body,
      (read) => read.derivativeState === 'ready' || read.derivativeState === 'failed',
      { timeoutMs: 120_000, intervalMs: 500, describe: (read) => `derivatives still ${read.derivativeState}` },
    );
    if (scan.derivativeState !== 'ready') throw new Error(`derivatives ended ${scan.derivativeState}: ${scan.derivativeError}`);
  });

  afterAll(async () => {
    await context?.close();
    await chromium?.close();
    await server?.close();
    rmSync(workDir, { recursive: true, force: true });
  });

  async function blankPageWithViewer(tileRequests: string[]): Promise<Page> {
    const page = await context.newPage();
    page.on('request', (request) => {
      const path = new URL(request.url()).pathname;
      if (path.startsWith(`/iiif/3/${scan.id}/`) && path.endsWith('/default.jpg')) tileRequests.push(`${path} ${request.headers()['authorization'] ? 'with token' : 'without token'}`);
    });
    await page.goto(`${server.url}/api/health`);
    await page.addScriptTag({ path: OPENSEADRAGON });
    return page;
  }

  it('when OpenSeadragon opens the info.json with the token, then it requests tiles and draws them', async () => {
    const tileRequests: string[] = [];
    const page = await blankPageWithViewer(tileRequests);

    const report = await openInViewer(page, `/iiif/3/${scan.id}/info.json`, token);

    expect(report.failure).toBeNull();
    expect(report.opened).toBe(true);
    expect(report.tilesDrawn).toBeGreaterThan(0);
    expect(tileRequests.length).toBeGreaterThan(0);
    expect(tileRequests.every((r) => r.endsWith('with token'))).toBe(true);
    // The sheet is cream paper: a drawn tile lights most of the canvas, an undrawn one leaves it black.
    expect(report.paintedShare).toBeGreaterThan(0.3);
    await page.close();
  });

  it('when the viewer starts from the manifest, then the canvas’s image service opens and draws', async () => {
    const tileRequests: string[] = [];
    const page = await blankPageWithViewer(tileRequests);
    const manifest = await page.evaluate(
      async ({ path, token }) => (await (await fetch(path, { headers: { Authorization: `Bearer ${token}` } })).json()) as ManifestSketch,
      { path: `/iiif/3/${scan.id}/manifest`, token },
    );
    const canvas = manifest.items[0];
    const body = canvas.items[0].items[0].body;
    const service = (Array.isArray(body.service) ? body.service : [body.service])[0];

    const report = await openInViewer(page, `${service.id ?? service['@id']}/info.json`, token);

    // IIIF Presentation API 3.0 §3: Manifest → Canvas → AnnotationPage → painting Annotation → Image with ImageService3.
    expect(manifest.type).toBe('Manifest');
    expect(canvas.type).toBe('Canvas');
    expect([canvas.width, canvas.height]).toEqual([scan.widthPx, scan.heightPx]);
    expect(canvas.items[0].items[0].motivation).toBe('painting');
    expect(service.type).toBe('ImageService3');
    expect(manifest.metadata.some((pair) => pair.label['en']?.[0] === 'File name')).toBe(true);
    expect(report.failure).toBeNull();
    expect(report.tilesDrawn).toBeGreaterThan(0);
    expect(tileRequests.length).toBeGreaterThan(0);
    await page.close();
  });
});
