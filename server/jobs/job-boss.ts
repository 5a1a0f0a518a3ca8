import { CompiledQuery } from 'kysely';
import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import type { DbOrTrx } from '../db/database';

/** The queue of derivative jobs; job data `{ scanId }`. */
export const DERIVATIVES_QUEUE = 'scan-derivatives';
/** pg-boss keeps its tables in a schema of its own beside the app's. */
export const JOB_SCHEMA = 'pgboss';

/** Retries with exponential back-off; a crash mid-job leaves the job active until it expires, then it runs again. */
export const DERIVATIVE_JOB_OPTIONS = { retryLimit: 3, retryBackoff: true, retryDelay: 5, expireInSeconds: 15 * 60 } as const;

export interface DerivativeJobData {
  scanId: string;
}

/**
 * A started pg-boss on the app's database, with the derivatives queue created. `isWorker: false` (the web
 * server) only sends jobs: no maintenance or cron supervision runs in that process.
 */
export async function startJobBoss(databaseUrl: string, options: { isWorker: boolean; logger?: Logger }): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: databaseUrl,
    schema: JOB_SCHEMA,
    max: options.isWorker ? 4 : 2,
    supervise: options.isWorker,
    schedule: false,
  });
  // pg-boss reports failed maintenance and polling here; without a listener an 'error' event would end the process.
  boss.on('error', (error) => options.logger?.error({ err: error }, 'job queue error'));
  await boss.start();
  await boss.createQueue(DERIVATIVES_QUEUE);
  return boss;
}

/** Lets pg-boss run its SQL through a Kysely db or transaction, so a job is sent in the same transaction as its scan rows. */
function asPgBossDb(db: DbOrTrx): PgBoss.Db {
  return {
    async executeSql(text: string, values: unknown[]) {
      const result = await db.executeQuery(CompiledQuery.raw(text, values));
      return { rows: result.rows as unknown[] };
    },
  } as PgBoss.Db;
}

/** Sends derivative jobs; what the app and the demo seed enqueue through. */
export interface DerivativeJobs {
  /** Enqueues one job per scan through `db` (pass the transaction that wrote the scans). */
  enqueue(db: DbOrTrx, scanIds: string[]): Promise<void>;
}

export function pgBossDerivativeJobs(boss: PgBoss): DerivativeJobs {
  return {
    async enqueue(db, scanIds) {
      for (const scanId of scanIds) {
        await boss.send(DERIVATIVES_QUEUE, { scanId } satisfies DerivativeJobData, { ...DERIVATIVE_JOB_OPTIONS, db: asPgBossDb(db) });
      }
    },
  };
}
