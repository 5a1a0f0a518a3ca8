/**
 * `npm test`: starts a throwaway PostgreSQL on a free loopback port, runs every suite one after another
 * (unit, client, api, e2e), prints each suite's counts, and removes the cluster whatever happened.
 * `npx tsx scripts/test.ts api e2e` runs only the named suites; words after `--` go to jest as path
 * patterns (`npx tsx scripts/test.ts api -- people` runs the API specs whose path holds "people").
 */
import { chmodSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { ensureChromium } from './lib/chromium';
import { ensureClientBuild } from './lib/client-build';
import { findFreePort } from './lib/free-port';
import { LocalPostgres } from './lib/local-postgres';
import { startMailFake, type RunningMailFake } from './lib/mail-fake';
import { runCommand } from './lib/run-command';

const ROOT = resolve(__dirname, '..');
const SUITES = ['unit', 'client', 'api', 'e2e'] as const;
type Suite = (typeof SUITES)[number];

interface SuiteResult {
  suite: Suite;
  passed: number;
  failed: number;
  total: number;
  exitCode: number;
  seconds: number;
}

function pickSuites(args: string[]): Suite[] {
  if (args.length === 0) return [...SUITES];
  const unknown = args.filter((a) => !(SUITES as readonly string[]).includes(a));
  if (unknown.length > 0) throw new Error(`unknown suite(s) ${unknown.join(', ')}; choose from ${SUITES.join(', ')}`);
  return args as Suite[];
}

async function runSuite(suite: Suite, env: NodeJS.ProcessEnv, workDir: string, patterns: string[]): Promise<SuiteResult> {
  const started = Date.now();
  const report = join(workDir, `${suite}.json`);
  const inBand = suite === 'api' || suite === 'e2e';
  const args = ['--selectProjects', suite, '--json', `--outputFile=${report}`, '--ci'];
  if (inBand) args.push('--runInBand');
  else args.push('--maxWorkers=2');
  args.push(...patterns);
  console.log(`\n━━ ${suite} suite ━━`);
  const exitCode = await runCommand(join(ROOT, 'node_modules', '.bin', 'jest'), args, { cwd: ROOT, env });
  let passed = 0;
  let failed = 0;
  let total = 0;
  try {
    const json = JSON.parse(readFileSync(report, 'utf8')) as { numPassedTests: number; numFailedTests: number; numTotalTests: number; numRuntimeErrorTestSuites: number };
    passed = json.numPassedTests;
    failed = json.numFailedTests + json.numRuntimeErrorTestSuites;
    total = json.numTotalTests;
  } catch {
    // No report means jest itself failed before running anything; the exit code says so below.
    failed = 1;
  }
  return { suite, passed, failed, total, exitCode, seconds: (Date.now() - started) / 1000 };
}

async function main(): Promise<number> {
  const argv = process.argv.slice(2);
  const split = argv.indexOf('--');
  const suites = pickSuites(split === -1 ? argv : argv.slice(0, split));
  const patterns = split === -1 ? [] : argv.slice(split + 1);
  const workDir = mkdtempSync(join(tmpdir(), 'isallo-test-'));
  // PostgreSQL runs as its own account when we are root: let it enter the folder when the folders above allow
  // (LocalPostgres keeps the cluster in the account's home when they do not).
  chmodSync(workDir, 0o755);
  const needsDb = suites.includes('api') || suites.includes('e2e');
  const postgres = needsDb ? new LocalPostgres(join(workDir, 'pg'), await findFreePort()) : null;
  // Ctrl-C reaches every process of the group and wrappers pass it on again, so a signal can arrive twice:
  // keep the handlers (a second signal would otherwise kill us mid-cleanup) and clean up once.
  let cleanup: Promise<void> | undefined;
  let mailFake: RunningMailFake | undefined;
  const stopAll = () =>
    (cleanup ??= (async () => {
      await mailFake?.stop();
      // The cluster may live outside workDir (see LocalPostgres), so it is removed on its own.
      await postgres?.remove();
      rmSync(workDir, { recursive: true, force: true });
    })());
  process.on('SIGINT', () => void stopAll().then(() => process.exit(130)));
  process.on('SIGTERM', () => void stopAll().then(() => process.exit(143)));

  const results: SuiteResult[] = [];
  try {
    const env: NodeJS.ProcessEnv = { ...process.env, ISALLO_TEST_WORK_DIR: workDir, TZ: 'UTC' };
    delete env['DATABASE_URL'];
    if (needsDb) {
      // Invitations and password resets send mail: a local SMTP fake catches it, and the tests read its folder.
      const captureDir = join(workDir, 'mail');
      mailFake = await startMailFake(captureDir);
      env['SMTP_URL'] = mailFake.url;
      env['MAIL_CAPTURE_DIR'] = captureDir;
    }
    if (postgres) {
      await postgres.start();
      await postgres.ensureDatabase('isallo_api');
      await postgres.ensureDatabase('isallo_e2e');
      env['DATABASE_URL'] = postgres.url('isallo_api');
      env['E2E_DATABASE_URL'] = postgres.url('isallo_e2e');
    }
    if (suites.includes('e2e')) {
      env['CHROMIUM_PATH'] = await ensureChromium();
      env['CLIENT_DIR'] = await ensureClientBuild(ROOT);
    }
    for (const suite of suites) results.push(await runSuite(suite, env, workDir, patterns));
  } finally {
    await stopAll();
  }

  console.log('\nSuite      passed  failed  total   seconds');
  for (const r of results) {
    console.log(`${r.suite.padEnd(10)} ${String(r.passed).padStart(6)}  ${String(r.failed).padStart(6)}  ${String(r.total).padStart(5)}   ${r.seconds.toFixed(1).padStart(7)}`);
  }
  const passed = results.reduce((n, r) => n + r.passed, 0);
  const failed = results.reduce((n, r) => n + r.failed, 0);
  const isGreen = results.every((r) => r.exitCode === 0) && failed === 0 && passed > 0;
  console.log(`\n${passed} passed, ${failed} failed`);
  return isGreen ? 0 : 1;
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  },
);
