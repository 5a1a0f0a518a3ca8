import { chmodSync, existsSync, mkdirSync, mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Client } from 'pg';
import { chooseClusterFolder, movedClusterName, POSTGRES_CLUSTERS_ROOT } from './cluster-folder';
import { findFreePort } from './free-port';
import { LocalPostgres } from './local-postgres';
import { isRoot } from './postgres-binaries';

describe('chooseClusterFolder', () => {
  it('when the postgres account can enter the wanted folder, then the cluster stays there', () => {
    expect(chooseClusterFolder('/home/ana/isallo/.data/postgres', true)).toBe('/home/ana/isallo/.data/postgres');
  });

  it('when it cannot, then the cluster goes to a folder of the account named after the checkout and its path', () => {
    const dir = chooseClusterFolder('/root/isallo/.data/postgres', false);
    expect(dir).toMatch(new RegExp(`^${POSTGRES_CLUSTERS_ROOT}/isallo-[0-9a-f]{12}$`));
  });

  it('when two checkouts have the same name, then their moved clusters differ', () => {
    expect(movedClusterName('/root/a/isallo/.data/postgres')).not.toBe(movedClusterName('/root/b/isallo/.data/postgres'));
    expect(movedClusterName('/root/a/isallo/.data/postgres')).toBe(movedClusterName('/root/a/isallo/.data/postgres'));
  });

  it('when the nearest folder name is odd, then the name keeps only safe characters', () => {
    expect(movedClusterName('/tmp/my clone (2)/pg')).toMatch(/^my_clone__2_-[0-9a-f]{12}$/);
    expect(movedClusterName('/pg')).toMatch(/^cluster-[0-9a-f]{12}$/);
  });
});

describe('LocalPostgres in a folder only its owner may enter', () => {
  let home: string;
  let clustersRoot: string;

  beforeAll(() => {
    // mkdtemp makes a mode-700 folder: as root, the postgres account cannot enter it.
    home = mkdtempSync(join(tmpdir(), 'isallo-closed-'));
    chmodSync(home, 0o700);
    clustersRoot = join(mkdtempSync(join(tmpdir(), 'isallo-clusters-')), 'clusters');
    chmodSync(join(clustersRoot, '..'), 0o755);
    mkdirSync(join(home, 'isallo', '.data'), { recursive: true });
  });

  afterAll(() => {
    rmSync(home, { recursive: true, force: true });
    rmSync(join(clustersRoot, '..'), { recursive: true, force: true });
  });

  it('when started, then it initialises, starts, answers, stops and is removed', async () => {
    const wanted = join(home, 'isallo', '.data', 'postgres');
    const postgres = new LocalPostgres(wanted, await findFreePort(), clustersRoot);

    await postgres.start();
    try {
      // As root the cluster moves out of the closed folder; anyone else runs PostgreSQL as themselves, in place.
      expect(postgres.dataDir).toBe(isRoot() ? join(clustersRoot, movedClusterName(wanted)) : wanted);
      expect(existsSync(join(postgres.dataDir, 'PG_VERSION'))).toBe(true);
      expect(statSync(home).mode & 0o777).toBe(0o700);
      const client = new Client({ connectionString: postgres.url('postgres') });
      await client.connect();
      const answer = await client.query<{ one: number }>('select 1 as one');
      await client.end();
      expect(answer.rows[0]?.one).toBe(1);
    } finally {
      await postgres.remove();
    }

    expect(existsSync(postgres.dataDir)).toBe(false);
    await expect(new Client({ connectionString: postgres.url('postgres') }).connect()).rejects.toThrow();
  }, 120_000);
});
