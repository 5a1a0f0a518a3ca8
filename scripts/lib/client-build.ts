import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { runCommand } from './run-command';

const SOURCES = ['client', 'shared', 'angular.json', 'package-lock.json'];

function newestMtimeMs(path: string): number {
  if (!existsSync(path)) return 0;
  const stats = statSync(path);
  if (!stats.isDirectory()) return stats.mtimeMs;
  let newest = stats.mtimeMs;
  for (const entry of readdirSync(path)) {
    if (entry === 'node_modules') continue;
    newest = Math.max(newest, newestMtimeMs(join(path, entry)));
  }
  return newest;
}

/** Builds the Angular client into dist/client/browser unless the build is newer than every source. */
export async function ensureClientBuild(root: string): Promise<string> {
  const outDir = join(root, 'dist', 'client', 'browser');
  const index = join(outDir, 'index.html');
  const builtAt = existsSync(index) ? statSync(index).mtimeMs : 0;
  const changedAt = Math.max(...SOURCES.map((source) => newestMtimeMs(join(root, source))));
  if (builtAt > changedAt) return outDir;
  console.log('Building the client (ng build)…');
  const code = await runCommand(join(root, 'node_modules', '.bin', 'ng'), ['build', '--progress=false'], {
    cwd: root,
    env: { ...process.env, NG_CLI_ANALYTICS: 'false' },
  });
  if (code !== 0) throw new Error('ng build failed; see the messages above');
  return outDir;
}
