/**
 * `npm start`: the app with the invented demo scenario. Starts (or reuses) the local PostgreSQL cluster in
 * .data/postgres unless DATABASE_URL is set, migrates, seeds the demo once, builds the client when its
 * sources changed, serves app and API from one process on 127.0.0.1, and runs the derivatives worker
 * (server/jobs/worker-cli.ts) as a child process beside it. Ctrl-C stops all three cleanly.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { loadConfig, ConfigError } from '../server/config';
import { startServer, type RunningServer } from '../server/server';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../server/demo/demo-scenario';
import { ensureClientBuild } from './lib/client-build';
import { LocalPostgres } from './lib/local-postgres';
import { startMailFake, type RunningMailFake } from './lib/mail-fake';

const ROOT = resolve(__dirname, '..');
const DATA_DIR = join(ROOT, '.data');
// Both can be moved, so that two checkouts can run side by side (ISALLO_POSTGRES_PORT, PORT).
const POSTGRES_PORT = Number(process.env['ISALLO_POSTGRES_PORT'] ?? 54329);
const APP_PORT = 4300;
/** How long the worker may take to finish the job in hand after Ctrl-C. */
const WORKER_STOP_MS = 30_000;

/** Starts the derivatives worker with the server's variables; its output goes to this terminal. */
function spawnWorker(env: NodeJS.ProcessEnv): ChildProcess {
  const worker = spawn(process.execPath, ['--import', 'tsx', join(ROOT, 'server', 'jobs', 'worker-cli.ts')], { cwd: ROOT, env, stdio: 'inherit' });
  worker.on('exit', (code, signal) => {
    if (code !== 0 && signal === null) console.error(`The derivatives worker stopped (exit code ${code}); scans will wait in "queued" until the next start.`);
  });
  return worker;
}

/** Asks the worker to stop (SIGTERM) and waits for it, killing it after WORKER_STOP_MS. */
function stopWorker(worker: ChildProcess | null): Promise<void> {
  if (!worker || worker.exitCode !== null || worker.signalCode !== null) return Promise.resolve();
  return new Promise((resolveStop) => {
    const timer = setTimeout(() => worker.kill('SIGKILL'), WORKER_STOP_MS);
    worker.once('exit', () => {
      clearTimeout(timer);
      resolveStop();
    });
    worker.kill('SIGTERM');
  });
}

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
  let worker: ChildProcess | null = null;
  let mailFake: RunningMailFake | null = null;
  let isStopping = false;
  const stop = async (code: number) => {
    if (isStopping) return;
    isStopping = true;
    console.log('\nStopping Isallo…');
    await stopWorker(worker);
    await server?.close().catch((error: unknown) => console.error(error));
    await mailFake?.stop();
    await postgres?.stop();
    process.exit(code);
  };
  // Ctrl-C reaches every process of the group and npm/tsx pass it on again: keep listening, stop once.
  process.on('SIGINT', () => void stop(0));
  process.on('SIGTERM', () => void stop(0));

  try {
    if (postgres) {
      await postgres.start();
      await postgres.ensureDatabase('isallo');
    }
    const clientDir = await ensureClientBuild(ROOT);
    // Without a real mail server (SMTP_URL), mail goes to a local fake whose catch the admin reads in the app.
    if (!process.env['SMTP_URL']) mailFake = await startMailFake(join(DATA_DIR, 'mail'));
    const env = {
      ...process.env,
      DATABASE_URL: userDatabaseUrl ?? postgres!.url('isallo'),
      JWT_SECRET: process.env['JWT_SECRET'] ?? readOrCreateJwtSecret(),
      HOST: process.env['HOST'] ?? '127.0.0.1',
      PORT: process.env['PORT'] ?? String(APP_PORT),
      STORAGE_DIR: process.env['STORAGE_DIR'] ?? join(DATA_DIR, 'storage'),
      CLIENT_DIR: clientDir,
      LOG_LEVEL: process.env['LOG_LEVEL'] ?? 'warn',
      ...(mailFake ? { SMTP_URL: mailFake.url, MAIL_CAPTURE_DIR: join(DATA_DIR, 'mail') } : {}),
    };
    const config = loadConfig(env);
    // The server migrates and seeds (queuing the demo scans' derivative jobs) before the worker starts taking them.
    server = await startServer(config, { demoFixturesDir: join(ROOT, 'fixtures') });
    worker = spawnWorker(env);
  } catch (error) {
    console.error(error instanceof ConfigError || error instanceof Error ? error.message : error);
    await stop(1);
    return;
  }

  console.log(`\nIsallo is running at ${server.url}\n`);
  console.log(`Demo sign-ins (password "${DEMO_PASSWORD}" for each):`);
  for (const person of DEMO_PEOPLE) console.log(`  ${person.email.padEnd(28)} ${person.roles.join(', ')}`);
  if (mailFake) console.log(`\nMail goes to a local fake (${mailFake.url}); an admin reads it at ${server.url}/people/mails.`);
  console.log('\nThe derivatives worker (thumbnails, previews, IIIF tiles) runs beside the server.');
  console.log('Press Ctrl-C to stop the server, the worker and the database.');
}

void main();
