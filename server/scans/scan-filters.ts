import type { ScanStatus } from '@shared/api/scans';
import { sql, type ExpressionBuilder, type Expression, type SqlBool } from 'kysely';
import type { Database } from '../db/database';

/** Catalogue filters after parsing (times as Dates). */
export interface ScanFilter {
  status?: ScanStatus;
  stationId?: string;
  instrumentId?: string;
  chartFormId?: string;
  batchId?: string;
  from?: Date;
  to?: Date;
  tags?: string[];
  q?: string;
  /** Leave withdrawn scans out whatever the status filter says (volunteers never see them). */
  hideWithdrawn?: boolean;
  /** Longest span_end − span_start in the catalogue, ms (read by the repository before a date-range query). */
  longestSpanMs?: number;
}

type ScanExpressions = ExpressionBuilder<Database, 'scan'>;

/**
 * The WHERE of a catalogue query. `from`/`to` keep charts whose span [span_start, span_end] (kept by the
 * scan_span trigger) overlaps them.
 * A scan with neither a chart form nor a chart-off time spans just the instant span_start.
 * `withStatus: false` leaves status out, for the counts per status.
 */
export function scanFilterWhere(filter: ScanFilter, options: { withStatus: boolean } = { withStatus: true }) {
  return (eb: ScanExpressions): Expression<SqlBool> => {
    const conditions: Expression<SqlBool>[] = [];
    if (options.withStatus && filter.status) conditions.push(eb('scan.status', '=', filter.status));
    if (filter.hideWithdrawn) conditions.push(eb('scan.status', '<>', 'withdrawn'));
    if (filter.stationId) conditions.push(eb('scan.station_id', '=', filter.stationId));
    if (filter.instrumentId) conditions.push(eb('scan.instrument_id', '=', filter.instrumentId));
    if (filter.chartFormId) conditions.push(eb('scan.chart_form_id', '=', filter.chartFormId));
    if (filter.batchId) conditions.push(eb('scan.batch_id', '=', filter.batchId));
    if (filter.from || filter.to) {
      // Overlap of closed intervals: span_start ≤ to and span_end ≥ from. The extra lower bound on span_start
      // (no chart is longer than the longest span catalogued) turns it into a range the b-tree on
      // (span_start, span_end) reads directly, with row estimates from the column statistics.
      conditions.push(eb('scan.span_start', 'is not', null));
      if (filter.to) conditions.push(eb('scan.span_start', '<=', filter.to));
      if (filter.from) {
        conditions.push(eb('scan.span_end', '>=', filter.from));
        conditions.push(eb('scan.span_start', '>=', new Date(filter.from.getTime() - (filter.longestSpanMs ?? 0))));
      }
    }
    if (filter.tags && filter.tags.length > 0) conditions.push(sql<SqlBool>`scan.tags @> ${sql.val(filter.tags)}::text[]`);
    if (filter.q) conditions.push(sql<SqlBool>`scan.search @@ websearch_to_tsquery('simple', ${filter.q})`);
    return eb.and(conditions);
  };
}
