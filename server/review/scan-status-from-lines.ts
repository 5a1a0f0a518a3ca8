import type { InkLineStatus } from '@shared/api/ink-lines';
import type { ScanStatus } from '@shared/api/scans';
import * as auditRepository from '../audit/scan-audit.repository';
import type { DbOrTrx } from '../db/database';
import * as scansRepository from '../scans/scans.repository';
import { findInkLinesRequired, findScanInkLines } from './ink-line-state.repository';

/** The statuses a scan moves between by itself as its ink lines are handed in and decided. */
const FOLLOWING_STATUSES: readonly ScanStatus[] = ['ready_to_trace', 'traced', 'approved'];

/**
 * The scan status its ink lines give: approved once `required` lines are approved, traced while any line is
 * handed in or approved, otherwise `withoutLines` (ready to trace for a live scan, received for a restored one).
 */
export function statusFromInkLines(statuses: readonly InkLineStatus[], required: number, withoutLines: ScanStatus): ScanStatus {
  const approved = statuses.filter((status) => status === 'approved').length;
  if (approved >= required) return 'approved';
  if (statuses.some((status) => status === 'handed_in' || status === 'approved')) return 'traced';
  return withoutLines;
}

/**
 * Brings a live scan's status in line with its ink lines (call after a decision, in its transaction), auditing a
 * change. A received or withdrawn scan is left alone: only the archivist moves it.
 */
export async function settleScanStatus(trx: DbOrTrx, scanId: string, personId: string): Promise<ScanStatus> {
  const scan = await scansRepository.findScanForTracing(trx, scanId, { forUpdate: true });
  if (!scan) throw new Error(`scan ${scanId} vanished inside its own transaction`);
  if (!FOLLOWING_STATUSES.includes(scan.status)) return scan.status;
  const lines = await findScanInkLines(trx, scanId);
  const target = statusFromInkLines(
    lines.map((line) => line.status),
    await findInkLinesRequired(trx, scan.stationId),
    'ready_to_trace',
  );
  if (target !== scan.status) {
    await scansRepository.updateScanStatus(trx, scanId, target);
    await auditRepository.insertScanAudit(trx, { scanId, personId, action: 'status', changes: { status: { before: scan.status, after: target } } });
  }
  return target;
}
