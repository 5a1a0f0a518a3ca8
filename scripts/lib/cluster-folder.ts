import { createHash } from 'node:crypto';
import { basename, dirname, join } from 'node:path';

/** Where clusters go when the postgres account cannot enter the checkout: a folder of its own home. */
export const POSTGRES_CLUSTERS_ROOT = '/var/lib/postgresql/isallo-clusters';

/**
 * The folder a cluster lives in. The wanted folder when the account that runs PostgreSQL can enter it;
 * otherwise one folder per wanted path under `clustersRoot`, named so that a person can tell whose it is
 * (the nearest folder name that is not hidden) and so that two checkouts never share one (a hash of the path).
 */
export function chooseClusterFolder(wantedDir: string, ownerCanEnter: boolean, clustersRoot = POSTGRES_CLUSTERS_ROOT): string {
  if (ownerCanEnter) return wantedDir;
  return join(clustersRoot, movedClusterName(wantedDir));
}

/** `<checkout>-<first 12 hex digits of sha256(path)>`, e.g. `isallo-3f9a0c12de45` for `/root/isallo/.data/postgres`. */
export function movedClusterName(wantedDir: string): string {
  const hash = createHash('sha256').update(wantedDir).digest('hex').slice(0, 12);
  return `${readableName(wantedDir)}-${hash}`;
}

function readableName(wantedDir: string): string {
  // Skip the cluster's own folder and hidden ones (.data): the name a person knows is the checkout's.
  for (let dir = dirname(wantedDir); dir !== dirname(dir); dir = dirname(dir)) {
    const name = basename(dir);
    if (!name.startsWith('.')) return name.replace(/[^A-Za-z0-9_-]/g, '_') || 'cluster';
  }
  return 'cluster';
}
