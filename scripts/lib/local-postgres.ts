import { chmodSync, chownSync, existsSync, mkdirSync, readdirSync, rmSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { Client } from 'pg';
import { chooseClusterFolder, POSTGRES_CLUSTERS_ROOT } from './cluster-folder';
import { ensurePostgresBin, isRoot } from './postgres-binaries';
import { runChecked, runCommand } from './run-command';

const SUPERUSER = 'isallo';

/**
 * A PostgreSQL cluster in a folder of ours, listening on 127.0.0.1 only.
 * As root the server runs as Debian's `postgres` account (PostgreSQL refuses to run as root); when that
 * account cannot enter the wanted folder (a clone in a mode-700 home or a `mktemp -d` folder), the cluster
 * is kept in a folder of the account's own home instead, one per wanted path, and a line says where.
 */
export class LocalPostgres {
  private binDir = '';
  private startedHere = false;
  private chosenDir: string | null = null;

  constructor(
    readonly wantedDir: string,
    readonly port: number,
    private readonly clustersRoot = POSTGRES_CLUSTERS_ROOT,
  ) {}

  /** The folder the cluster lives in (known once start() has run). */
  get dataDir(): string {
    return this.chosenDir ?? this.wantedDir;
  }

  /** The URL of a database in this cluster. */
  url(database: string): string {
    return `postgres://${SUPERUSER}@127.0.0.1:${this.port}/${database}`;
  }

  /** Creates the cluster on first use and starts it; a cluster that is already running is reused. */
  async start(): Promise<void> {
    this.binDir = await ensurePostgresBin();
    this.chosenDir = await this.chooseFolder();
    if (!existsSync(join(this.dataDir, 'PG_VERSION'))) await this.initCluster();
    if (await this.isRunning()) {
      console.log(`PostgreSQL is already running in ${this.dataDir}; reusing it.`);
      return;
    }
    const logFile = join(this.dataDir, 'server.log');
    const options = `-p ${this.port} -c listen_addresses=127.0.0.1 -c unix_socket_directories='${this.dataDir}' -c fsync=${process.env['CI'] ? 'off' : 'on'}`;
    await runChecked(...this.asOwner(join(this.binDir, 'pg_ctl'), ['-D', this.dataDir, '-o', options, '-l', logFile, '-w', '-t', '60', 'start']));
    this.startedHere = true;
  }

  /** Stops the server if this process started it. */
  async stop(): Promise<void> {
    if (!this.startedHere) return;
    this.startedHere = false;
    await runCommand(...this.asOwner(join(this.binDir, 'pg_ctl'), ['-D', this.dataDir, '-m', 'fast', '-w', 'stop']), { stdio: 'ignore' });
  }

  /** Stops the server if this process started it and deletes the cluster's folder. */
  async remove(): Promise<void> {
    await this.stop();
    rmSync(this.dataDir, { recursive: true, force: true });
  }

  /** Creates a database when it does not exist yet. */
  async ensureDatabase(name: string): Promise<void> {
    if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`invalid database name ${name}`);
    const client = new Client({ connectionString: this.url('postgres') });
    await client.connect();
    try {
      const found = await client.query('select 1 from pg_database where datname = $1', [name]);
      if (found.rowCount === 0) await client.query(`create database ${name}`);
    } finally {
      await client.end();
    }
  }

  private async chooseFolder(): Promise<string> {
    const canEnter = !isRoot() || (await this.ownerCanEnter(this.wantedDir));
    const dir = chooseClusterFolder(this.wantedDir, canEnter, this.clustersRoot);
    if (dir !== this.wantedDir) {
      this.prepareClustersRoot();
      console.log(`The postgres account cannot enter ${this.wantedDir}; this checkout's cluster is kept in ${dir}.`);
    }
    return dir;
  }

  /** Whether the postgres account can reach the wanted folder (asked of the account itself, so ACLs and groups count). */
  private async ownerCanEnter(dir: string): Promise<boolean> {
    let existing = dir;
    while (!existsSync(existing)) existing = dirname(existing);
    const code = await runCommand('runuser', ['-u', 'postgres', '--', 'test', '-x', existing], { stdio: 'ignore' });
    return code === 0;
  }

  private prepareClustersRoot(): void {
    mkdirSync(this.clustersRoot, { recursive: true, mode: 0o700 });
    const { uid, gid } = postgresAccount();
    chownSync(this.clustersRoot, uid, gid);
  }

  private async isRunning(): Promise<boolean> {
    const code = await runCommand(...this.asOwner(join(this.binDir, 'pg_ctl'), ['-D', this.dataDir, 'status']), { stdio: 'ignore' });
    return code === 0;
  }

  private async initCluster(): Promise<void> {
    // Folders on the way are created enterable (a umask of 077 must not lock the account out); the cluster's own is 700.
    mkdirSync(dirname(this.dataDir), { recursive: true, mode: 0o755 });
    mkdirSync(this.dataDir, { recursive: true, mode: 0o700 });
    chmodSync(this.dataDir, 0o700);
    if (readdirSync(this.dataDir).length > 0) {
      throw new Error(`${this.dataDir} is not empty but holds no PostgreSQL cluster; move it away and start again.`);
    }
    this.giveToOwner();
    console.log(`Creating a PostgreSQL cluster in ${this.dataDir}…`);
    await runChecked(
      ...this.asOwner(join(this.binDir, 'initdb'), ['-D', this.dataDir, '-U', SUPERUSER, '-A', 'trust', '--encoding=UTF8', '--no-locale']),
    );
  }

  /** As root, hands the data folder to the postgres account. */
  private giveToOwner(): void {
    if (!isRoot()) return;
    const { uid, gid } = postgresAccount();
    chownSync(this.dataDir, uid, gid);
  }

  private asOwner(command: string, args: string[]): [string, string[]] {
    return isRoot() ? ['runuser', ['-u', 'postgres', '--', command, ...args]] : [command, args];
  }
}

function postgresAccount(): { uid: number; gid: number } {
  // Debian's postgresql-common package creates this account; its home is /var/lib/postgresql.
  const home = '/var/lib/postgresql';
  if (!existsSync(home)) throw new Error('the postgres system account is missing; reinstall Debian\'s postgresql package');
  const stats = statSync(home);
  return { uid: stats.uid, gid: stats.gid };
}
