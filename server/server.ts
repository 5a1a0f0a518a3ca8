import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { type Config, ConfigError, loadConfig } from './config';
import { createDb } from './db/create-db';
import { migrateToLatest } from './db/migrate';
import { seedDemo } from './demo/seed-demo';
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
}

/** Migrates the database, builds the app and listens; used by this file's main and by in-process tests. */
export async function startServer(config: Config, options: StartOptions = {}): Promise<RunningServer> {
  const logger = createLogger(config.logLevel);
  const db = createDb(config.databaseUrl);
  const storage = createFileStorage(config.storageDir);
  try {
    await migrateToLatest(db);
    await storage.ensureFolders();
    if (options.demoFixturesDir) await seedDemo(db, storage, { fixturesDir: options.demoFixturesDir, logger });
  } catch (error) {
    await db.destroy();
    throw error;
  }
  const app = createApp({ db, storage, config, logger });
  const server = app.listen(config.port, config.host);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  const url = `http://${config.host.includes(':') ? `[${config.host}]` : config.host}:${port}`;
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
  process.once('SIGINT', () => stop('SIGINT'));
  process.once('SIGTERM', () => stop('SIGTERM'));
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
