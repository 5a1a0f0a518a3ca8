import { chownSync, existsSync, mkdirSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { Client } from 'pg';
import { ensurePostgresBin, isRoot } from './postgres-binaries';
import { runChecked, runCommand } from './run-command';

const SUPERUSER = 'isallo';

/**
 * A PostgreSQL cluster in a folder of ours, listening on 127.0.0.1 only.
 * As root the server runs as Debian's `postgres` account (PostgreSQL refuses to run as root).
 */
export class LocalPostgres {
  private binDir = '';
  private startedHere = false;

  constructor(
    readonly dataDir: string,
    readonly port: number,
  ) {}

  /** The URL of a database in this cluster. */
  url(database: string): string {
    return `postgres://${SUPERUSER}@127.0.0.1:${this.port}/${database}`;
  }

  /** Creates the cluster on first use and starts it; a cluster that is already running is reused. */
  async start(): Promise<void> {
    this.binDir = await ensurePostgresBin();
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

  private async isRunning(): Promise<boolean> {
    const code = await runCommand(...this.asOwner(join(this.binDir, 'pg_ctl'), ['-D', this.dataDir, 'status']), { stdio: 'ignore' });
    return code === 0;
  }

  private async initCluster(): Promise<void> {
    mkdirSync(this.dataDir, { recursive: true, mode: 0o700 });
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
