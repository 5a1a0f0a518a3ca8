import { missingForTracing } from '@shared/api/scan-status';
import type { Db } from '../db/database';
import * as auditRepository from '../audit/scan-audit.repository';
import * as scansRepository from './scans.repository';

/**
 * Marks a scan's derivatives ready and, when the scan was catalogued whole at upload, moves it to ready to
 * trace in the same transaction. An upload with station, chart form and chart start stays received until its
 * tiles and preview exist: the status route refuses ready to trace without derivatives, and so does this
 * path. A scan someone has edited or moved since upload is left to them.
 */
export async function markDerivativesReady(db: Db, scanId: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    await scansRepository.setDerivativeState(trx, scanId, 'ready');
    const scan = await scansRepository.lockScan(trx, scanId);
    if (!scan || scan.status !== 'received' || missingForTracing(scan).length > 0) return;
    const uploader = await trx.selectFrom('scan').select('uploaded_by').where('id', '=', scanId).executeTakeFirstOrThrow();
    // Untouched since upload (its log holds the upload alone), so the metadata it has now is what it came with.
    const touched = await trx.selectFrom('scan_audit').select('id').where('scan_id', '=', scanId).where('action', '!=', 'upload').executeTakeFirst();
    if (touched) return;
    await scansRepository.updateScanStatus(trx, scanId, 'ready_to_trace');
    // Written in the uploader's name: it is their upload's metadata that made the move.
    await auditRepository.insertScanAudit(trx, {
      scanId,
      personId: uploader.uploaded_by,
      action: 'status',
      changes: { status: { before: 'received', after: 'ready_to_trace' } },
    });
  });
}
