import { sql } from 'kysely';
import type PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import type { Db } from '../db/database';
import { markDerivativesReady } from '../scans/ready-after-derivatives';
import * as scansRepository from '../scans/scans.repository';
import type { Storage } from '../storage/storage';
import { DERIVATIVES_QUEUE, JOB_SCHEMA, pgBossDerivativeJobs, type DerivativeJobData } from './job-boss';
import { makeDerivatives } from './make-derivatives';
import { startSeriesWorker } from './series-jobs';

export interface WorkerDeps {
  db: Db;
  storage: Storage;
  /** A started pg-boss (startJobBoss with isWorker: true). */
  boss: PgBoss;
  logger: Logger;
  /** Seconds between polls for new jobs (pg-boss minimum 0.5). */
  pollingIntervalSeconds?: number;
}

export interface RunningWorker {
  /** Stops taking jobs and waits for the one in hand. */
  stop(): Promise<void>;
}

/** Jobs of scans left queued or working by a crash or by a database migrated from before derivatives: send them again. */
async function sweepStuckScans(deps: WorkerDeps): Promise<number> {
  const scanIds = await scansRepository.findScanIdsNeedingDerivatives(deps.db);
  if (scanIds.length === 0) return 0;
  // A scan whose job still waits (or runs elsewhere, or awaits expiry after a crash, when pg-boss retries it) is left alone.
  const { rows } = await sql<{ scan_id: string }>`
    select data->>'scanId' as scan_id from ${sql.table(`${JOB_SCHEMA}.job`)}
    where name = ${DERIVATIVES_QUEUE} and state in ('created', 'retry', 'active')`.execute(deps.db);
  const waiting = new Set(rows.map((row) => row.scan_id));
  const orphans = scanIds.filter((scanId) => !waiting.has(scanId));
  await pgBossDerivativeJobs(deps.boss).enqueue(deps.db, orphans);
  return orphans.length;
}

async function runJob(deps: WorkerDeps, job: PgBoss.JobWithMetadata<DerivativeJobData>): Promise<void> {
  const { scanId } = job.data;
  const file = await scansRepository.findScanFile(deps.db, scanId);
  if (!file) {
    deps.logger.warn({ scanId }, 'derivative job for a scan that no longer exists');
    return;
  }
  await scansRepository.setDerivativeState(deps.db, scanId, 'working', { isAttempt: true });
  if (!(await deps.storage.exists(file.storageKey))) {
    // Retrying cannot bring a lost master back: fail now, with the reason, instead of after every back-off.
    await scansRepository.setDerivativeState(deps.db, scanId, 'failed', { error: `The master file ${file.storageKey} is missing from storage.` });
    deps.logger.error({ scanId, storageKey: file.storageKey }, 'master file missing');
    return;
  }
  try {
    await makeDerivatives(deps.storage, file);
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const isLastTry = job.retryCount >= job.retryLimit;
    // Between tries the scan shows queued with the last reason; after the last one it shows failed.
    await scansRepository.setDerivativeState(deps.db, scanId, isLastTry ? 'failed' : 'queued', { error: message });
    deps.logger.warn({ scanId, attempt: job.retryCount + 1, err: error }, 'derivatives failed');
    throw error;
  }
  await markDerivativesReady(deps.db, scanId);
  deps.logger.info({ scanId }, 'derivatives ready');
}

/**
 * Takes `scan-derivatives` jobs one at a time (the machine has few cores and each job decodes a whole
 * scan). First requeues scans a crash left behind. Beside them it keeps the station series built (series-jobs.ts).
 */
export async function startWorker(deps: WorkerDeps): Promise<RunningWorker> {
  const inFlight = new Set<Promise<void>>();
  const swept = await sweepStuckScans(deps);
  if (swept > 0) deps.logger.info({ swept }, 'requeued scans waiting for derivatives');
  const workerId = await deps.boss.work<DerivativeJobData>(
    DERIVATIVES_QUEUE,
    { batchSize: 1, includeMetadata: true, pollingIntervalSeconds: deps.pollingIntervalSeconds ?? 2 },
    async ([job]) => {
      if (!job) return;
      const running = runJob(deps, job);
      inFlight.add(running);
      try {
        await running;
      } finally {
        inFlight.delete(running);
      }
    },
  );
  const seriesWorker = await startSeriesWorker({ db: deps.db, boss: deps.boss, logger: deps.logger, pollingIntervalSeconds: deps.pollingIntervalSeconds });
  return {
    async stop() {
      await seriesWorker.stop();
      await deps.boss.offWork({ id: workerId });
      await Promise.allSettled([...inFlight]);
    },
  };
}

