import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { startServer, type RunningServer } from '../../server/server';
import { testConfig } from '../helpers/test-app';

describe('server started in-process', () => {
  let workDir: string;
  let running: RunningServer;

  beforeAll(async () => {
    workDir = await fs.mkdtemp(path.join(process.env['ISALLO_TEST_WORK_DIR'] ?? os.tmpdir(), 'isallo-start-'));
    const clientDir = path.join(workDir, 'client');
    await fs.mkdir(clientDir, { recursive: true });
    await fs.writeFile(path.join(clientDir, 'index.html'), '<!doctype html><title>Isallo</title><app-root></app-root>');
    await fs.writeFile(path.join(clientDir, 'main-ABCDEFGH.js'), 'console.log(1);');
    running = await startServer(testConfig(path.join(workDir, 'storage'), { clientDir }));
  });

  afterAll(async () => {
    await running.close();
    await fs.rm(workDir, { recursive: true, force: true });
  });

  it('when the server is started with port 0, then it listens on loopback and answers the health check', async () => {
    const response = await fetch(`${running.url}/api/health`);

    expect(running.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
    expect(await response.json()).toEqual({ ok: true });
  });

  it('when a client route is opened directly, then index.html is served for the client router', async () => {
    const response = await fetch(`${running.url}/bench/7a1c`, { headers: { Accept: 'text/html' } });

    expect(response.status).toBe(200);
    expect(await response.text()).toContain('<app-root>');
    expect(response.headers.get('cache-control')).toBe('no-cache');
  });

  it('when a hashed asset is fetched, then it is served with a long cache lifetime', async () => {
    const response = await fetch(`${running.url}/main-ABCDEFGH.js`);

    expect(response.status).toBe(200);
    expect(response.headers.get('cache-control')).toContain('immutable');
  });

  it('when an unknown /api path is opened, then it is a JSON 404 and not the client', async () => {
    const response = await fetch(`${running.url}/api/bench/7a1c`, { headers: { Accept: 'text/html' } });

    expect(response.status).toBe(404);
    expect(((await response.json()) as { error: { code: string } }).error.code).toBe('not_found');
  });
});
