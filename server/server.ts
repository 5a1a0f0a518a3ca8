import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { type Config, ConfigError, loadConfig } from './config';
import { createDb } from './db/create-db';
import { migrateToLatest } from './db/migrate';
import { seedDemo } from './demo/seed-demo';
import { pgBossDerivativeJobs, startJobBoss } from './jobs/job-boss';
import { startWorker, type RunningWorker } from './jobs/worker';
import { createLogger } from './logger';
import { createFileStorage } from './storage/storage';

export interface RunningServer {
  /** Base URL, e.g. http://127.0.0.1:3000 (the real port when config.port is 0). */
  url: string;
  /** Stops accepting requests, waits for open ones, then closes the database pool. */
  close(): Promise<void>;
}

export interface StartOptions {
  /** Seed the demo scenario from this fixtures folder (e.g. `fixtures`) before listening. */
  demoFixturesDir?: string;
  /** Also run the derivatives worker in this process (browser tests); `npm start` runs it as a child process instead. */
  withWorker?: boolean;
}

/** Migrates the database, builds the app and listens; used by this file's main and by in-process tests. */
export async function startServer(config: Config, options: StartOptions = {}): Promise<RunningServer> {
  const logger = createLogger(config.logLevel);
  const db = createDb(config.databaseUrl);
  const storage = createFileStorage(config.storageDir);
  let boss: Awaited<ReturnType<typeof startJobBoss>> | undefined;
  let workerBoss: Awaited<ReturnType<typeof startJobBoss>> | undefined;
  let worker: RunningWorker | undefined;
  const stopJobs = async () => {
    await worker?.stop();
    await workerBoss?.stop({ graceful: true, wait: true, timeout: 30_000 });
    await boss?.stop({ graceful: true, wait: true, timeout: 10_000 });
  };
  try {
    await migrateToLatest(db);
    await storage.ensureFolders();
    boss = await startJobBoss(config.databaseUrl, { isWorker: false, logger });
    const jobs = pgBossDerivativeJobs(boss);
    if (options.demoFixturesDir) await seedDemo({ db, storage, jobs }, { fixturesDir: options.demoFixturesDir, logger });
    if (options.withWorker) {
      workerBoss = await startJobBoss(config.databaseUrl, { isWorker: true, logger });
      worker = await startWorker({ db, storage, boss: workerBoss, logger: logger.child({ process: 'worker' }), pollingIntervalSeconds: 0.5 });
    }
  } catch (error) {
    await stopJobs().catch(() => undefined);
    await db.destroy();
    throw error;
  }
  const jobs = pgBossDerivativeJobs(boss);
  // Listen first, then build the app: without PUBLIC_URL its links and IIIF ids use the address bound (port 0 in tests).
  const server = createServer();
  server.listen(config.port, config.host);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  const url = `http://${config.host.includes(':') ? `[${config.host}]` : config.host}:${port}`;
  const app = createApp({ db, storage, config: Object.freeze({ ...config, publicUrl: config.publicUrl || url }), logger, jobs });
  server.on('request', app);
  logger.info({ url }, 'Isallo is listening');

  let closing: Promise<void> | undefined;
  return {
    url,
    close() {
      closing ??= (async () => {
        await new Promise<void>((resolve, reject) => {
          server.close((error) => (error ? reject(error) : resolve()));
          // Idle keep-alive sockets would hold close() open until they time out.
          server.closeIdleConnections();
        });
        await stopJobs();
        await db.destroy();
        logger.info('Isallo has stopped');
      })();
      return closing;
    },
  };
}

async function main(): Promise<void> {
  let config: Config;
  try {
    config = loadConfig(process.env);
  } catch (error) {
    if (!(error instanceof ConfigError)) throw error;
    console.error(error.message);
    process.exit(1);
  }
  const running = await startServer(config);
  const stop = (signal: string) => {
    console.log(`${signal} received, shutting down`);
    running.close().then(
      () => process.exit(0),
      (error: unknown) => {
        console.error(error);
        process.exit(1);
      },
    );
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('unhandledRejection', (reason) => {
    console.error('unhandled promise rejection', reason);
    process.exit(1);
  });
}

if (require.main === module) {
  main().catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  });
}
