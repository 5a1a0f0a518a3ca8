import { existsSync } from 'node:fs';
import { isRoot } from './postgres-binaries';
import { runCommand } from './run-command';

const CANDIDATES = ['/usr/bin/chromium', '/usr/bin/chromium-browser'];

/** Path of Debian's Chromium; as root installs the `chromium` package when it is missing. */
export async function ensureChromium(): Promise<string> {
  const found = CANDIDATES.find((path) => existsSync(path));
  if (found) return found;
  if (isRoot() && existsSync('/usr/bin/apt-get')) {
    console.log("Chromium is not installed; installing Debian's chromium package for the browser suite…");
    const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
    await runCommand('apt-get', ['update', '-qq'], { env });
    await runCommand('apt-get', ['install', '-y', '-qq', 'chromium'], { env });
    const installed = CANDIDATES.find((path) => existsSync(path));
    if (installed) return installed;
  }
  throw new Error('The browser suite needs Debian\'s Chromium at /usr/bin/chromium (sudo apt-get install chromium).');
}
