import type { ScanDetail, ScanStatus } from '@shared/api/scans';
import { SCAN_STATUS_LABELS } from '@shared/api/scans';
import { AppError, HTTP } from '../errors/app-error';

/**
 * The moves an archivist may make. `traced` and `approved` follow the scan's ink lines (a hand-in, a review
 * decision), never this route; any state may be withdrawn (with a reason), and a withdrawn scan is restored
 * (asked as received; it comes back to the status its ink lines give, see scans.service.ts).
 */
export const ALLOWED_STATUS_MOVES: Record<ScanStatus, readonly ScanStatus[]> = {
  received: ['ready_to_trace', 'withdrawn'],
  ready_to_trace: ['received', 'withdrawn'],
  traced: ['ready_to_trace', 'withdrawn'],
  approved: ['withdrawn'],
  withdrawn: ['received'],
};

/** What a scan lacks before volunteers may trace it, as field names (empty when nothing). */
export function missingForTracing(scan: Pick<ScanDetail, 'stationId' | 'chartFormId' | 'chartStart' | 'derivativeState'>): string[] {
  const missing: string[] = [];
  if (!scan.stationId) missing.push('stationId');
  if (!scan.chartFormId) missing.push('chartFormId');
  if (!scan.chartStart) missing.push('chartStart');
  if (scan.derivativeState !== 'ready') missing.push('derivativeState');
  return missing;
}

const MISSING_LABELS: Record<string, string> = {
  stationId: 'a station',
  chartFormId: 'a chart form',
  chartStart: 'a chart start',
  derivativeState: 'its derivatives (tiles and preview) ready',
};

/** Throws 409 unless the move is allowed and, for ready to trace, the scan has everything tracing needs. */
export function checkStatusMove(scan: ScanDetail, to: ScanStatus): void {
  if (scan.status === to) throw new AppError(HTTP.conflict, 'conflict', `The scan is already ${SCAN_STATUS_LABELS[to]}.`);
  if ((to === 'traced' || to === 'approved') && (scan.status === 'traced' || scan.status === 'approved')) {
    throw new AppError(
      HTTP.conflict,
      'scan_status_follows_ink_lines',
      `A scan becomes ${SCAN_STATUS_LABELS[to]} through its ink lines: approve or return them in Review.`,
      { allowed: ALLOWED_STATUS_MOVES[scan.status] },
    );
  }
  if (!ALLOWED_STATUS_MOVES[scan.status].includes(to)) {
    throw new AppError(HTTP.conflict, 'conflict', `A scan that is ${SCAN_STATUS_LABELS[scan.status]} cannot become ${SCAN_STATUS_LABELS[to]}.`, {
      allowed: ALLOWED_STATUS_MOVES[scan.status],
    });
  }
  if (to === 'ready_to_trace') {
    const missing = missingForTracing(scan);
    if (missing.length > 0) {
      throw new AppError(
        HTTP.conflict,
        'conflict',
        `The scan cannot be ready to trace without ${missing.map((field) => MISSING_LABELS[field]).join(', ')}.`,
        { missing },
      );
    }
  }
}
