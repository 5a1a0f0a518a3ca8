/**
 * `npm start`: the app with the invented demo scenario. Starts (or reuses) the local PostgreSQL cluster in
 * .data/postgres unless DATABASE_URL is set, migrates, seeds the demo once, builds the client when its
 * sources changed, and serves app and API from one process on 127.0.0.1. Ctrl-C stops both cleanly.
 */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { loadConfig, ConfigError } from '../server/config';
import { startServer, type RunningServer } from '../server/server';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../server/demo/demo-scenario';
import { ensureClientBuild } from './lib/client-build';
import { LocalPostgres } from './lib/local-postgres';

const ROOT = resolve(__dirname, '..');
const DATA_DIR = join(ROOT, '.data');
const POSTGRES_PORT = 54329;
const APP_PORT = 4300;

/** A signing secret kept in .data so that sign-ins survive a restart of the demo. */
function readOrCreateJwtSecret(): string {
  const file = join(DATA_DIR, 'jwt-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  const secret = randomBytes(32).toString('hex');
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

async function main(): Promise<void> {
  mkdirSync(DATA_DIR, { recursive: true });
  const userDatabaseUrl = process.env['DATABASE_URL'];
  const postgres = userDatabaseUrl ? null : new LocalPostgres(join(DATA_DIR, 'postgres'), POSTGRES_PORT);
  let server: RunningServer | null = null;
  let isStopping = false;
  const stop = async (code: number) => {
    if (isStopping) return;
    isStopping = true;
    console.log('\nStopping Isallo…');
    await server?.close().catch((error: unknown) => console.error(error));
    await postgres?.stop();
    process.exit(code);
  };
  process.once('SIGINT', () => void stop(0));
  process.once('SIGTERM', () => void stop(0));

  try {
    if (postgres) {
      await postgres.start();
      await postgres.ensureDatabase('isallo');
    }
    const clientDir = await ensureClientBuild(ROOT);
    const config = loadConfig({
      ...process.env,
      DATABASE_URL: userDatabaseUrl ?? postgres!.url('isallo'),
      JWT_SECRET: process.env['JWT_SECRET'] ?? readOrCreateJwtSecret(),
      HOST: process.env['HOST'] ?? '127.0.0.1',
      PORT: process.env['PORT'] ?? String(APP_PORT),
      STORAGE_DIR: process.env['STORAGE_DIR'] ?? join(DATA_DIR, 'storage'),
      CLIENT_DIR: clientDir,
      LOG_LEVEL: process.env['LOG_LEVEL'] ?? 'warn',
    });
    server = await startServer(config, { demoFixturesDir: join(ROOT, 'fixtures') });
  } catch (error) {
    console.error(error instanceof ConfigError || error instanceof Error ? error.message : error);
    await stop(1);
    return;
  }

  console.log(`\nIsallo is running at ${server.url}\n`);
  console.log(`Demo sign-ins (password "${DEMO_PASSWORD}" for each):`);
  for (const person of DEMO_PEOPLE) console.log(`  ${person.email.padEnd(28)} ${person.roles.join(', ')}`);
  console.log('\nPress Ctrl-C to stop the server and the database.');
}

void main();
