import type { DeskClaim } from '@shared/api/desk';
import { sql } from 'kysely';
import type { Db, DbOrTrx } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import { CLAIM_HOURS, isQueuedFor, queuePriority } from './chart-queue';

/** Charts tried per "Next chart" before giving up: each one lost to a concurrent claim is skipped. */
const MAX_CLAIM_ATTEMPTS = 10;

function selectClaims(db: DbOrTrx) {
  return db
    .selectFrom('chart_claim')
    .innerJoin('scan', 'scan.id', 'chart_claim.scan_id')
    .leftJoin('station', 'station.id', 'scan.station_id')
    .select(['chart_claim.scan_id', 'chart_claim.expires_at', 'station.name as station_name', 'scan.chart_start', 'scan.original_name', 'scan.box']);
}

type ClaimRow = { scan_id: string; expires_at: Date; station_name: string | null; chart_start: Date | null; original_name: string; box: string };

function toClaim(row: ClaimRow): DeskClaim {
  return {
    scanId: row.scan_id,
    stationName: row.station_name,
    chartStart: row.chart_start?.toISOString() ?? null,
    originalName: row.original_name,
    box: row.box,
    expiresAt: row.expires_at.toISOString(),
  };
}

/** The volunteer's open claim on a chart they have not handed in yet (at most one; see claimNextChart). */
export async function findOpenClaim(db: DbOrTrx, personId: string): Promise<DeskClaim | null> {
  const row = await selectClaims(db)
    .where('chart_claim.person_id', '=', personId)
    .where('chart_claim.expires_at', '>', sql<Date>`now()`)
    .orderBy('chart_claim.claimed_at')
    .executeTakeFirst();
  return row ? toClaim(row) : null;
}

/** How many charts the queue holds for the volunteer now. */
export async function countQueued(db: DbOrTrx, personId: string): Promise<number> {
  const { total } = await db
    .selectFrom('scan')
    .select((eb) => eb.fn.countAll<number>().as('total'))
    .where(isQueuedFor(personId))
    .executeTakeFirstOrThrow();
  return Number(total);
}

/**
 * "Next chart": the volunteer's open claim if they hold one (a second click takes no second chart), else the
 * queue's first chart by priority, then oldest chart start. The candidate is locked with SKIP LOCKED, so two
 * volunteers asking at once get different charts, and its room is counted again after the lock, since a claim
 * committed meanwhile does not show in the first look.
 */
export async function claimNextChart(db: Db, personId: string): Promise<DeskClaim | null> {
  return db.transaction().execute(async (trx) => {
    const held = await findOpenClaim(trx, personId);
    if (held) return held;
    const skipped: string[] = [];
    for (let attempt = 0; attempt < MAX_CLAIM_ATTEMPTS; attempt += 1) {
      let query = trx
        .selectFrom('scan')
        .select('scan.id')
        .where(isQueuedFor(personId))
        .orderBy(queuePriority, 'desc')
        .orderBy('scan.chart_start', 'asc')
        .orderBy('scan.id')
        .limit(1)
        .forUpdate()
        .skipLocked();
      if (skipped.length > 0) query = query.where('scan.id', 'not in', skipped);
      const candidate = await query.executeTakeFirst();
      if (!candidate) return null;
      const stillOpen = await trx.selectFrom('scan').select('scan.id').where('scan.id', '=', candidate.id).where(isQueuedFor(personId)).executeTakeFirst();
      if (!stillOpen) {
        skipped.push(candidate.id);
        continue;
      }
      await trx
        .insertInto('chart_claim')
        .values({ scan_id: candidate.id, person_id: personId, expires_at: new Date(Date.now() + CLAIM_HOURS * 3_600_000) })
        .onConflict((oc) => oc.columns(['scan_id', 'person_id']).doUpdateSet({ claimed_at: new Date(), expires_at: new Date(Date.now() + CLAIM_HOURS * 3_600_000) }))
        .execute();
      return findOpenClaim(trx, personId);
    }
    return null;
  });
}

/** Ends the volunteer's claim on a chart (handed in, or given back). True when there was one. */
export async function releaseClaim(db: DbOrTrx, scanId: string, personId: string): Promise<boolean> {
  const result = await db.deleteFrom('chart_claim').where('scan_id', '=', scanId).where('person_id', '=', personId).executeTakeFirst();
  return Number(result.numDeletedRows) > 0;
}

/** Gives a claimed chart back to the queue; 404 claim_not_found when the volunteer holds no claim on it. */
export async function giveBackClaim(db: Db, scanId: string, personId: string): Promise<void> {
  if (!(await releaseClaim(db, scanId, personId))) throw new AppError(HTTP.notFound, 'claim_not_found', 'You hold no claim on this chart.');
}
