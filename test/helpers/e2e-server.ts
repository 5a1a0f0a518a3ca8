import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { loadConfig } from '../../server/config';
import { startServer, type RunningServer } from '../../server/server';

const ROOT = resolve(__dirname, '../..');

/**
 * Starts the real server in-process for one browser suite: the e2e database from scripts/test.ts, a storage
 * folder of the suite's own, the built client and the demo scenario. The caller closes the server and
 * removes `workDir`.
 */
export async function startE2eServer(suite: string, options: { withWorker?: boolean } = {}): Promise<{ server: RunningServer; workDir: string }> {
  const workDir = mkdtempSync(join(tmpdir(), `isallo-e2e-${suite}-`));
  const databaseUrl = process.env['E2E_DATABASE_URL'];
  if (!databaseUrl) throw new Error('E2E_DATABASE_URL is not set; run the browser suite through scripts/test.ts');
  const config = loadConfig({
    DATABASE_URL: databaseUrl,
    JWT_SECRET: `e2e-secret-of-the-${suite}-suite`,
    PORT: '0',
    STORAGE_DIR: join(workDir, 'storage'),
    CLIENT_DIR: process.env['CLIENT_DIR'] ?? join(ROOT, 'dist/client/browser'),
    LOG_LEVEL: 'warn',
    SMTP_URL: process.env['SMTP_URL'],
    MAIL_CAPTURE_DIR: process.env['MAIL_CAPTURE_DIR'],
  });
  const server = await startServer(config, { demoFixturesDir: join(ROOT, 'fixtures'), withWorker: options.withWorker ?? false });
  return { server, workDir };
}
