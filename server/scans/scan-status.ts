import type { ScanDetail, ScanStatus } from '@shared/api/scans';
import { SCAN_STATUS_LABELS } from '@shared/api/scans';
import { ALLOWED_STATUS_MOVES, canMoveStatus, missingForTracing, type TracingNeed } from '@shared/api/scan-status';
import { AppError, HTTP } from '../errors/app-error';

const MISSING_LABELS: Record<TracingNeed, string> = {
  stationId: 'a station',
  chartFormId: 'a chart form',
  chartStart: 'a chart start',
  derivativeState: 'its derivatives (tiles and preview) ready',
};

/** Throws 409 unless the move is allowed and, for ready to trace, the scan has everything tracing needs. */
export function checkStatusMove(scan: ScanDetail, to: ScanStatus): void {
  if (scan.status === to) throw new AppError(HTTP.conflict, 'status_unchanged', `The scan is already ${SCAN_STATUS_LABELS[to]}.`);
  if ((to === 'traced' || to === 'approved') && (scan.status === 'traced' || scan.status === 'approved')) {
    throw new AppError(
      HTTP.conflict,
      'scan_status_follows_ink_lines',
      `A scan becomes ${SCAN_STATUS_LABELS[to]} through its ink lines: approve or return them in Review.`,
      { allowed: ALLOWED_STATUS_MOVES[scan.status] },
    );
  }
  if (!canMoveStatus(scan.status, to)) {
    throw new AppError(HTTP.conflict, 'status_move_not_allowed', `A scan that is ${SCAN_STATUS_LABELS[scan.status]} cannot become ${SCAN_STATUS_LABELS[to]}.`, {
      allowed: ALLOWED_STATUS_MOVES[scan.status],
    });
  }
  if (to === 'ready_to_trace') {
    const missing = missingForTracing(scan);
    if (missing.length > 0) {
      throw new AppError(
        HTTP.conflict,
        'scan_incomplete',
        `The scan cannot be ready to trace without ${missing.map((field) => MISSING_LABELS[field]).join(', ')}.`,
        { missing },
      );
    }
  }
}
