import type PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import type { Db } from '../db/database';
import { buildPendingSeries } from '../series/series-build';
import { findStationsWithPendingChanges } from '../series/station-series.repository';

/** The queue of station series builds; job data `{ stationId }`. */
export const SERIES_QUEUE = 'series-build';

/** Retries a failed build with back-off; a build is one transaction, so a crash leaves the old series whole. */
const SERIES_JOB_OPTIONS = { retryLimit: 5, retryBackoff: true, retryDelay: 5, expireInSeconds: 30 * 60 } as const;

export interface SeriesJobData {
  stationId: string;
}

/**
 * The queue is `stately`: at most one queued and one running build per station (the singleton key), so a
 * burst of decisions on one station becomes one or two builds, each reading every change since the last.
 */
export async function createSeriesQueue(boss: PgBoss): Promise<void> {
  await boss.createQueue(SERIES_QUEUE, { name: SERIES_QUEUE, policy: 'stately' });
}

/** Sends a build for every station whose series_change rows run past its build cursor. */
export async function enqueuePendingSeriesBuilds(db: Db, boss: PgBoss): Promise<number> {
  const stationIds = await findStationsWithPendingChanges(db);
  for (const stationId of stationIds) {
    await boss.send(SERIES_QUEUE, { stationId } satisfies SeriesJobData, { ...SERIES_JOB_OPTIONS, singletonKey: stationId });
  }
  return stationIds.length;
}

export interface SeriesWorkerDeps {
  db: Db;
  boss: PgBoss;
  logger: Logger;
  /** Seconds between looks at series_change (the outbox the decisions write into). */
  sweepIntervalSeconds?: number;
  pollingIntervalSeconds?: number;
}

/**
 * Keeps every station series built: looks at series_change every few seconds (decisions only write rows
 * there, in their own transactions, see series-change.ts) and builds each station with unread changes
 * through the queue. Readers never wait for it: a read finds unread changes itself and builds first.
 */
export async function startSeriesWorker(deps: SeriesWorkerDeps): Promise<{ stop(): Promise<void> }> {
  await createSeriesQueue(deps.boss);
  const inFlight = new Set<Promise<unknown>>();
  const workerId = await deps.boss.work<SeriesJobData>(
    SERIES_QUEUE,
    { batchSize: 1, pollingIntervalSeconds: deps.pollingIntervalSeconds ?? 2 },
    async ([job]) => {
      if (!job) return;
      const running = buildPendingSeries(deps.db, job.data.stationId);
      inFlight.add(running);
      try {
        const result = await running;
        if (result) deps.logger.info({ stationId: result.stationId, version: result.version, changes: result.changeCount, points: result.pointCount }, 'station series built');
      } finally {
        inFlight.delete(running);
      }
    },
  );
  let isStopped = false;
  let sweeping: Promise<unknown> = Promise.resolve();
  const sweep = () => {
    if (isStopped) return;
    sweeping = enqueuePendingSeriesBuilds(deps.db, deps.boss).catch((error: unknown) => deps.logger.warn({ err: error }, 'series sweep failed'));
  };
  sweep();
  const timer = setInterval(sweep, (deps.sweepIntervalSeconds ?? 2) * 1000);
  timer.unref();
  return {
    async stop() {
      isStopped = true;
      clearInterval(timer);
      await sweeping;
      await deps.boss.offWork({ id: workerId });
      await Promise.allSettled([...inFlight]);
    },
  };
}
