import type { DeskLine, DeskSection, TracingProgressRow, ProgressGroup, TracePriority, TracePriorityInput } from '@shared/api/desk';
import { tracePriorityKey } from '@shared/api/desk';
import type { InkLineStatus } from '@shared/api/ink-lines';
import type { PageQuery } from '@shared/api/paging';
import { sql } from 'kysely';
import type { DbOrTrx } from '../db/database';

const SECTION_STATUS: Record<DeskSection, InkLineStatus> = { drafts: 'draft', returned: 'returned', waiting: 'handed_in' };

/** A page of the volunteer's own ink lines in one Desk section, most recently changed first. */
export async function listDeskLines(db: DbOrTrx, personId: string, section: DeskSection, query: PageQuery): Promise<{ items: DeskLine[]; total: number }> {
  const status = SECTION_STATUS[section];
  const rows = await db
    .selectFrom('ink_line')
    .innerJoin('scan', 'scan.id', 'ink_line.scan_id')
    .leftJoin('station', 'station.id', 'scan.station_id')
    .select((eb) => [
      'ink_line.id',
      'ink_line.scan_id',
      'ink_line.status',
      'ink_line.version',
      'ink_line.updated_at',
      'station.name as station_name',
      'scan.chart_start',
      'scan.original_name',
      'scan.box',
      eb
        .selectFrom('ink_line_review')
        .select('ink_line_review.note')
        .whereRef('ink_line_review.ink_line_id', '=', 'ink_line.id')
        .where('ink_line_review.decision', '=', 'returned')
        .orderBy('ink_line_review.id', 'desc')
        .limit(1)
        .as('return_note'),
    ])
    .where('ink_line.author_id', '=', personId)
    .where('ink_line.status', '=', status)
    .orderBy('ink_line.updated_at', 'desc')
    .orderBy('ink_line.id')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await db
    .selectFrom('ink_line')
    .select((eb) => eb.fn.countAll<number>().as('total'))
    .where('author_id', '=', personId)
    .where('status', '=', status)
    .executeTakeFirstOrThrow();
  return {
    items: rows.map((row) => ({
      inkLineId: row.id,
      scanId: row.scan_id,
      stationName: row.station_name,
      chartStart: row.chart_start?.toISOString() ?? null,
      originalName: row.original_name,
      box: row.box,
      status: row.status,
      version: row.version,
      updatedAt: row.updated_at.toISOString(),
      // A draft reworked from a returned line keeps showing what the archivist asked for.
      returnNote: row.return_note ?? null,
    })),
    total: Number(total),
  };
}

/** The volunteer's ink lines counted by status. */
export async function countOwnLines(db: DbOrTrx, personId: string): Promise<Record<InkLineStatus, number>> {
  const rows = await db
    .selectFrom('ink_line')
    .select((eb) => ['status', eb.fn.countAll<number>().as('count')])
    .where('author_id', '=', personId)
    .groupBy('status')
    .execute();
  const counts: Record<InkLineStatus, number> = { draft: 0, handed_in: 0, approved: 0, returned: 0 };
  for (const row of rows) counts[row.status] = Number(row.count);
  return counts;
}

/**
 * Charts per station (or per station and box) by where they stand: received, ready (to trace, unclaimed),
 * claimed (ready or traced with an open claim), traced and approved. Paged by group, in station name order.
 */
export async function listProgress(db: DbOrTrx, group: ProgressGroup, query: PageQuery): Promise<{ items: TracingProgressRow[]; total: number }> {
  const byBox = group === 'box';
  const keys = byBox ? sql`station.id, station.name, scan.collection, scan.box` : sql`station.id, station.name`;
  const result = await sql<{
    station_id: string;
    station_name: string;
    collection: string | null;
    box: string | null;
    received: string;
    ready: string;
    claimed: string;
    traced: string;
    approved: string;
    total: string;
  }>`
    select station.id as station_id, station.name as station_name,
      ${byBox ? sql`scan.collection` : sql`null`} as collection, ${byBox ? sql`scan.box` : sql`null`} as box,
      count(*) filter (where scan.status = 'received') as received,
      count(*) filter (where scan.status = 'ready_to_trace' and not claimed.is_claimed) as ready,
      count(*) filter (where scan.status in ('ready_to_trace', 'traced') and claimed.is_claimed) as claimed,
      count(*) filter (where scan.status = 'traced') as traced,
      count(*) filter (where scan.status = 'approved') as approved,
      count(*) over () as total
    from scan
    join station on station.id = scan.station_id
    cross join lateral (
      select exists (select 1 from chart_claim c where c.scan_id = scan.id and c.expires_at > now()) as is_claimed
    ) as claimed
    where scan.status <> 'withdrawn'
    group by ${keys}
    order by station.name, station.id${byBox ? sql`, scan.collection, scan.box` : sql``}
    limit ${query.pageSize} offset ${query.page * query.pageSize}`.execute(db);
  const total = result.rows.length > 0 ? Number(result.rows[0].total) : 0;
  return {
    items: result.rows.map((row) => ({
      stationId: row.station_id,
      stationName: row.station_name,
      collection: row.collection,
      box: row.box,
      received: Number(row.received),
      ready: Number(row.ready),
      claimed: Number(row.claimed),
      traced: Number(row.traced),
      approved: Number(row.approved),
    })),
    total,
  };
}

export async function upsertStationTracing(db: DbOrTrx, stationId: string, inkLinesRequired: 1 | 2): Promise<void> {
  await db
    .insertInto('station_tracing')
    .values({ station_id: stationId, ink_lines_required: inkLinesRequired })
    .onConflict((oc) => oc.column('station_id').doUpdateSet({ ink_lines_required: inkLinesRequired, updated_at: new Date() }))
    .execute();
}

export async function upsertTracePriority(db: DbOrTrx, input: TracePriorityInput, personId: string): Promise<TracePriority> {
  const key = tracePriorityKey(input);
  const row = await db
    .insertInto('trace_priority')
    .values({ scope: input.scope, scope_key: key, priority: input.priority, set_by: personId })
    .onConflict((oc) => oc.columns(['scope', 'scope_key']).doUpdateSet({ priority: input.priority, set_by: personId, updated_at: new Date() }))
    .returning(['scope', 'scope_key', 'priority', 'updated_at'])
    .executeTakeFirstOrThrow();
  return { scope: row.scope, key: row.scope_key, priority: row.priority, updatedAt: row.updated_at.toISOString() };
}

export async function listTracePriorities(db: DbOrTrx, query: PageQuery): Promise<{ items: TracePriority[]; total: number }> {
  const rows = await db
    .selectFrom('trace_priority')
    .select(['scope', 'scope_key', 'priority', 'updated_at'])
    .orderBy('priority', 'desc')
    .orderBy('scope')
    .orderBy('scope_key')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await db.selectFrom('trace_priority').select((eb) => eb.fn.countAll<number>().as('total')).executeTakeFirstOrThrow();
  return { items: rows.map((row) => ({ scope: row.scope, key: row.scope_key, priority: row.priority, updatedAt: row.updated_at.toISOString() })), total: Number(total) };
}
