import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { runCommand } from './run-command';

const DEBIAN_ROOT = '/usr/lib/postgresql';

/** The bin folder of the newest PostgreSQL that Debian's packages installed, or null. */
export function findDebianPostgresBin(): string | null {
  if (!existsSync(DEBIAN_ROOT)) return null;
  const versions = readdirSync(DEBIAN_ROOT)
    .filter((name) => existsSync(join(DEBIAN_ROOT, name, 'bin', 'pg_ctl')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length > 0 ? join(DEBIAN_ROOT, versions[0], 'bin') : null;
}

export function isRoot(): boolean {
  return typeof process.getuid === 'function' && process.getuid() === 0;
}

/**
 * Finds PostgreSQL's server binaries; as root installs Debian's `postgresql` package when they are missing.
 * Anyone else gets a message saying what to install, because we never start a server we cannot own.
 */
export async function ensurePostgresBin(): Promise<string> {
  const found = findDebianPostgresBin();
  if (found) return found;
  if (isRoot() && existsSync('/usr/bin/apt-get')) {
    console.log('PostgreSQL is not installed; installing Debian\'s postgresql package…');
    const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
    await runCommand('apt-get', ['update', '-qq'], { env });
    const code = await runCommand('apt-get', ['install', '-y', '-qq', 'postgresql'], { env });
    const installed = findDebianPostgresBin();
    if (code === 0 && installed) return installed;
  }
  throw new Error(
    'PostgreSQL server binaries were not found under /usr/lib/postgresql. ' +
      'Install Debian\'s "postgresql" package (sudo apt-get install postgresql), or set DATABASE_URL to a server of your own.',
  );
}
