/**
 * The derivatives worker as a process of its own: `tsx server/jobs/worker-cli.ts` with the server's
 * variables (DATABASE_URL, STORAGE_DIR, LOG_LEVEL; JWT_SECRET is checked like the server's). scripts/start.ts
 * spawns it beside the web server. SIGINT/SIGTERM finish the job in hand and exit.
 */
import { ConfigError, loadConfig } from '../config';
import { createDb } from '../db/create-db';
import { migrateToLatest } from '../db/migrate';
import { createLogger } from '../logger';
import { createFileStorage } from '../storage/storage';
import { startJobBoss } from './job-boss';
import { startWorker } from './worker';

async function main(): Promise<void> {
  let config;
  try {
    config = loadConfig(process.env);
  } catch (error) {
    if (!(error instanceof ConfigError)) throw error;
    console.error(error.message);
    process.exit(1);
  }
  const logger = createLogger(config.logLevel).child({ process: 'worker' });
  const db = createDb(config.databaseUrl, 4);
  await migrateToLatest(db);
  const storage = createFileStorage(config.storageDir);
  await storage.ensureFolders();
  const boss = await startJobBoss(config.databaseUrl, { isWorker: true, logger });
  const worker = await startWorker({ db, storage, boss, logger });
  logger.info('derivatives worker started');

  let isStopping = false;
  const stop = async (signal: string) => {
    if (isStopping) return;
    isStopping = true;
    logger.info({ signal }, 'derivatives worker stopping');
    await worker.stop();
    await boss.stop({ graceful: true, wait: true, timeout: 30_000 });
    await db.destroy();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
  process.on('unhandledRejection', (reason) => {
    logger.error({ reason }, 'unhandled promise rejection');
    process.exit(1);
  });
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
