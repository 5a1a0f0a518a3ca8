import { type ExpressionBuilder, sql } from 'kysely';
import type { Database } from '../db/database';

/** A claim lasts this long, then the chart returns to the queue (the issue's default: 48 h). */
export const CLAIM_HOURS = 48;

/**
 * The queue's order for a scan: the highest priority the archivist set for its scan, box or station (0 when
 * none), as a SQL expression over `scan`.
 */
export function queuePriority(eb: ExpressionBuilder<Database, 'scan'>) {
  const priorityOf = (scope: 'station' | 'box' | 'scan', key: ReturnType<typeof sql<string>>) =>
    eb.selectFrom('trace_priority').select('trace_priority.priority').where('trace_priority.scope', '=', scope).where('trace_priority.scope_key', '=', key);
  return sql<number>`coalesce(greatest((${priorityOf('scan', sql<string>`scan.id::text`)}), (${priorityOf('box', sql<string>`scan.collection || '/' || scan.box`)}), (${priorityOf('station', sql<string>`scan.station_id::text`)})), 0)`;
}

/**
 * Lines a chart still takes: its station's required count less its ink lines (any state: drafts and returned
 * lines are their volunteers' work in progress) and the open claims of volunteers who have no line on it yet.
 */
export function openSlots(eb: ExpressionBuilder<Database, 'scan'>) {
  return sql<number>`coalesce((select st.ink_lines_required from station_tracing st where st.station_id = scan.station_id), 1)
    - (select count(*) from ink_line l where l.scan_id = scan.id)
    - (select count(*) from chart_claim c where c.scan_id = scan.id and c.expires_at > now()
         and not exists (select 1 from ink_line l2 where l2.scan_id = c.scan_id and l2.author_id = c.person_id))`;
}

/** Scans a volunteer may be handed: ready to trace or traced, with room for a line, and none of theirs on it. */
export function isQueuedFor(personId: string) {
  return (eb: ExpressionBuilder<Database, 'scan'>) =>
    eb.and([
      eb('scan.status', 'in', ['ready_to_trace', 'traced']),
      eb('scan.station_id', 'is not', null),
      eb('scan.chart_form_id', 'is not', null),
      eb('scan.chart_start', 'is not', null),
      eb.not(eb.exists(eb.selectFrom('ink_line').select('ink_line.id').whereRef('ink_line.scan_id', '=', 'scan.id').where('ink_line.author_id', '=', personId))),
      eb(openSlots(eb), '>', 0),
    ]);
}
