import type { ScanDetail, ScanStatus } from './scans';

/**
 * The moves an archivist may make. `traced` and `approved` follow the scan's ink lines (a hand-in, a review
 * decision), never a status move; any state may be withdrawn (with a reason), and a withdrawn scan is restored
 * (asked as received; it comes back to the status its ink lines give).
 */
export const ALLOWED_STATUS_MOVES: Record<ScanStatus, readonly ScanStatus[]> = {
  received: ['ready_to_trace', 'withdrawn'],
  ready_to_trace: ['received', 'withdrawn'],
  traced: ['ready_to_trace', 'withdrawn'],
  approved: ['withdrawn'],
  withdrawn: ['received'],
};

export function canMoveStatus(from: ScanStatus, to: ScanStatus): boolean {
  return ALLOWED_STATUS_MOVES[from].includes(to);
}

/** A field a scan needs before volunteers may trace it. */
export type TracingNeed = 'stationId' | 'chartFormId' | 'chartStart' | 'derivativeState';

/** The words for each need, as the forms show them. */
export const TRACING_NEED_LABELS: Record<TracingNeed, string> = {
  stationId: 'station',
  chartFormId: 'chart form',
  chartStart: 'chart start',
  derivativeState: 'derivatives',
};

/** What a scan lacks before volunteers may trace it, in a fixed order (empty when nothing). */
export function missingForTracing(scan: Pick<ScanDetail, TracingNeed>): TracingNeed[] {
  const missing: TracingNeed[] = [];
  if (!scan.stationId) missing.push('stationId');
  if (!scan.chartFormId) missing.push('chartFormId');
  if (!scan.chartStart) missing.push('chartStart');
  if (scan.derivativeState !== 'ready') missing.push('derivativeState');
  return missing;
}
