import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { Client } from 'pg';
import { loadConfig } from '../../server/config';
import { startServer, type RunningServer } from '../../server/server';

const ROOT = resolve(__dirname, '../..');

/**
 * A database of the suite's own on the e2e server, made empty. Each browser suite has its own storage folder,
 * so it needs its own database too: with a shared one, the second suite found the demo already seeded and
 * its scans' files in the first suite's (removed) folder, and every chart image came back missing.
 */
async function freshSuiteDatabase(e2eUrl: string, suite: string): Promise<string> {
  const name = `isallo_e2e_${suite.replace(/[^a-z0-9]/gi, '_').toLowerCase()}`;
  const client = new Client({ connectionString: e2eUrl });
  await client.connect();
  try {
    await client.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
    await client.query(`CREATE DATABASE "${name}"`);
  } finally {
    await client.end();
  }
  const url = new URL(e2eUrl);
  url.pathname = `/${name}`;
  return url.toString();
}

/**
 * Starts the real server in-process for one browser suite: a fresh database of its own on the e2e server from
 * scripts/test.ts (`databaseUrl`, for a test that reads the stored rows), a storage folder of its own, the built
 * client and the demo scenario. The caller closes the server and removes `workDir`.
 */
export async function startE2eServer(
  suite: string,
  options: { withWorker?: boolean } = {},
): Promise<{ server: RunningServer; workDir: string; databaseUrl: string }> {
  const workDir = mkdtempSync(join(tmpdir(), `isallo-e2e-${suite}-`));
  const e2eUrl = process.env['E2E_DATABASE_URL'];
  if (!e2eUrl) throw new Error('E2E_DATABASE_URL is not set; run the browser suite through scripts/test.ts');
  const databaseUrl = await freshSuiteDatabase(e2eUrl, suite);
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
  return { server, workDir, databaseUrl };
}
