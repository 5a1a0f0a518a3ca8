import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { sql } from 'kysely';
import pino from 'pino';
import { createApp } from '../../server/app';
import type { Config } from '../../server/config';
import { createDb } from '../../server/db/create-db';
import type { Database, Db } from '../../server/db/database';
import type PgBoss from 'pg-boss';
import { pgBossDerivativeJobs, startJobBoss, type DerivativeJobs } from '../../server/jobs/job-boss';
import { startWorker, type RunningWorker } from '../../server/jobs/worker';
import { createFileStorage, type Storage } from '../../server/storage/storage';
import { pollUntil } from './poll-until';

export const TEST_JWT_SECRET = 'test-secret-at-least-16-characters';

export interface TestContext {
  app: Express;
  db: Db;
  storage: Storage;
  config: Config;
  /** pg-boss (sending only) that the app enqueues derivative jobs through. */
  boss: PgBoss;
  jobs: DerivativeJobs;
  /** Starts the derivatives worker in this process (stopped by close()). */
  startWorker(): Promise<RunningWorker>;
  close(): Promise<void>;
}

/** A Config for tests: the API test database, a fresh storage folder, a silent logger level. */
export function testConfig(storageDir: string, overrides: Partial<Config> = {}): Config {
  const databaseUrl = process.env['DATABASE_URL'];
  if (!databaseUrl) throw new Error('DATABASE_URL is not set for the API tests');
  return {
    port: 0,
    host: '127.0.0.1',
    databaseUrl,
    jwtSecret: TEST_JWT_SECRET,
    tokenTtlSeconds: 3600,
    storageDir,
    clientDir: path.join(storageDir, 'no-client'),
    maxUploadBytes: 20 * 1024 * 1024,
    logLevel: 'silent',
    // scripts/test.ts starts the local SMTP fake and says where it writes what it captures.
    smtpUrl: process.env['SMTP_URL'] ?? '',
    mailFrom: 'Isallo <isallo@isallo.test>',
    mailCaptureDir: process.env['MAIL_CAPTURE_DIR'] ?? null,
    publicUrl: 'http://isallo.test',
    invitationTtlSeconds: 7 * 24 * 3600,
    behindTls: false,
    iiifCacheMaxBytes: 512 * 1024 * 1024,
    ...overrides,
  };
}

/** The app as createApp builds it, over the test database and a storage folder of its own. */
export async function createTestContext(overrides: Partial<Config> = {}): Promise<TestContext> {
  const parent = process.env['ISALLO_TEST_WORK_DIR'] ?? os.tmpdir();
  await fs.mkdir(parent, { recursive: true });
  const workDir = await fs.mkdtemp(path.join(parent, 'isallo-api-'));
  // npm start keeps its files in .data/storage; a dot segment in the path must not hide them from send().
  const storageDir = path.join(workDir, '.data', 'storage');
  await fs.mkdir(storageDir, { recursive: true });
  const config = testConfig(storageDir, overrides);
  const db = createDb(config.databaseUrl, 4);
  const storage = createFileStorage(storageDir);
  await storage.ensureFolders();
  const logger = pino({ level: 'silent' });
  const boss = await startJobBoss(config.databaseUrl, { isWorker: false });
  const jobs = pgBossDerivativeJobs(boss);
  const app = createApp({ db, storage, config, logger, jobs });
  const workers: { worker: RunningWorker; boss: PgBoss }[] = [];
  return {
    app,
    db,
    storage,
    config,
    boss,
    jobs,
    async startWorker() {
      const workerBoss = await startJobBoss(config.databaseUrl, { isWorker: true });
      const worker = await startWorker({ db, storage, boss: workerBoss, logger, pollingIntervalSeconds: 0.5 });
      workers.push({ worker, boss: workerBoss });
      return worker;
    },
    async close() {
      for (const { worker, boss: workerBoss } of workers) {
        await worker.stop();
        await workerBoss.stop({ graceful: true, wait: true, timeout: 10_000 });
      }
      await boss.stop({ graceful: false, wait: true, timeout: 5_000 });
      await db.destroy();
      await fs.rm(workDir, { recursive: true, force: true });
    },
  };
}

const APP_TABLES: (keyof Database)[] = [
  'register_change',
  'chart_claim',
  'trace_priority',
  'station_tracing',
  'cross_trace_agreement',
  'ink_line_review',
  'scan_audit',
  'intake_file',
  'intake_batch',
  'instrument',
  'series_point',
  'ink_line',
  'pin_set',
  'scan',
  'chart_form',
  'station',
  'people_change',
  'password_reset',
  'invitation',
  'person_role',
  'person',
  'demo_seed',
  'series_change',
  'station_series_point',
  'station_series_hourly',
  'station_series_daily',
  'station_series_state',
  'api_token',
];

/** Empties the given tables (default: every app table); CASCADE takes rows that point at them. */
export async function truncateTables(db: Db, tables: (keyof Database)[] = APP_TABLES): Promise<void> {
  await sql`truncate table ${sql.join(tables.map((table) => sql.table(table)))} cascade`.execute(db);
  // Jobs of the truncated scans would otherwise reach a later test's worker.
  await sql`delete from pgboss.job`.execute(db).catch(() => undefined);
}

/**
 * Waits until every given scan's derivatives are ready or failed (the worker runs them in the background),
 * checking the rows every 200 ms; fails after `timeoutMs`.
 */
export async function waitForDerivatives(db: Db, scanIds: string[], timeoutMs = 60_000): Promise<Record<string, string>> {
  const rows = await pollUntil(
    () => db.selectFrom('scan').select(['id', 'derivative_state']).where('id', 'in', scanIds).execute(),
    (found) => found.length === scanIds.length && found.every((row) => row.derivative_state === 'ready' || row.derivative_state === 'failed'),
    { timeoutMs, intervalMs: 200, describe: (found) => `derivatives not finished: ${JSON.stringify(found)}` },
  );
  return Object.fromEntries(rows.map((row) => [row.id, row.derivative_state]));
}

/** Every file under a folder, relative to it (for "nothing was stored" checks). */
export async function listFiles(folder: string): Promise<string[]> {
  try {
    const entries = await fs.readdir(folder, { recursive: true, withFileTypes: true });
    return entries
      .filter((entry) => entry.isFile())
      .map((entry) => path.relative(folder, path.join(entry.parentPath, entry.name)))
      .sort();
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
}

/** Empties the test's storage folder (masters, previews, derivatives, temp files) and recreates its folders. */
export async function clearStorage(storage: Storage): Promise<void> {
  await fs.rm(storage.rootDir, { recursive: true, force: true });
  await storage.ensureFolders();
}
