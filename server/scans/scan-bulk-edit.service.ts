import type { ScanBulkEditInput, ScanBulkEditResult, ScanDetail, ScanMetadataInput } from '@shared/api/scans';
import type { Db } from '../db/database';
import { AppError } from '../errors/app-error';
import { normalizeTags } from '@shared/api/parse-scan-metadata';
import { applyScanMetadata, getScan } from './scans.service';

/**
 * Sets the same station, instrument, chart form, box and added tags on many scans, and each its own chart
 * start, in one transaction: every scan is checked at the version the archivist read and by the same rules
 * as a single edit, and gets its own change-log entry. One refusal (a stale version, a traced scan's tracing
 * fields) rolls back every scan, and the error names the scan it was about.
 */
export async function bulkEditScans(db: Db, input: ScanBulkEditInput, personId: string): Promise<ScanBulkEditResult> {
  return db.transaction().execute(async (trx) => {
    const items: ScanDetail[] = [];
    for (const scan of input.scans) {
      const { addTags, ...fields } = input.set;
      const patch: ScanMetadataInput = { version: scan.version, ...fields };
      if (scan.chartStart !== undefined) patch.chartStart = scan.chartStart;
      try {
        if (addTags && addTags.length > 0) patch.tags = normalizeTags([...(await getScan(trx, scan.id)).tags, ...addTags]);
        items.push(await applyScanMetadata(trx, scan.id, patch, personId, 'edit'));
      } catch (error: unknown) {
        if (!(error instanceof AppError)) throw error;
        const details = typeof error.details === 'object' && error.details !== null ? error.details : {};
        throw new AppError(error.status, error.code, `Nothing was changed: scan ${scan.id} was refused. ${error.message}`, { scanId: scan.id, ...details });
      }
    }
    return { items };
  });
}
