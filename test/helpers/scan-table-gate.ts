import { Client } from 'pg';

/**
 * What the gate holds back: `inserts` takes SHARE mode (the service's hash lookup, ACCESS SHARE, still
 * runs; every INSERT, ROW EXCLUSIVE, waits), `reads` takes ACCESS EXCLUSIVE (the hash lookup waits too).
 */
export type ScanTableGateMode = 'inserts' | 'reads';

/** A lock held on the scan table from outside the app, so a test can stop an upload at a chosen step. */
export interface ScanTableGate {
  /** Resolves once `count` statements are waiting on the gate; fails after `timeoutMs`. */
  waitForWaiting(count: number, timeoutMs?: number): Promise<void>;
  /** Lets the waiting statements go (all at once) and closes the gate's connection. */
  open(): Promise<void>;
}

const LOCK_MODES: Record<ScanTableGateMode, string> = { inserts: 'share', reads: 'access exclusive' };

/**
 * Locks `scan` in a transaction on a connection of its own (not the app's pool, which it would starve).
 * With `inserts`, two copies sent together both pass the lookup and meet at the unique (sha256, page_index).
 */
export async function closeScanTableGate(databaseUrl: string, mode: ScanTableGateMode): Promise<ScanTableGate> {
  const client = new Client({ connectionString: databaseUrl });
  await client.connect();
  await client.query('begin');
  await client.query(`lock table scan in ${LOCK_MODES[mode]} mode`);
  return {
    async waitForWaiting(count, timeoutMs = 20_000) {
      const deadline = Date.now() + timeoutMs;
      for (;;) {
        const { rows } = await client.query<{ waiting: string }>(
          `select count(*) as waiting from pg_locks l join pg_class c on c.oid = l.relation where c.relname = 'scan' and not l.granted`,
        );
        if (Number(rows[0].waiting) >= count) return;
        if (Date.now() > deadline) throw new Error(`only ${rows[0].waiting} of ${count} statements reached the gate in ${timeoutMs} ms`);
        await new Promise((resolve) => setTimeout(resolve, 25));
      }
    },
    async open() {
      await client.query('commit');
      await client.end();
    },
  };
}
