import type { ScanDetail } from '@shared/api/scans';

import { ApiError } from '../../core/http/api-error';

/** How one upload ended: stored, a duplicate of a scan already in the archive, or rejected by the server. */
export type UploadOutcome =
  | { kind: 'stored'; scan: ScanDetail }
  | { kind: 'duplicate'; existingScanId: string | null; message: string }
  | { kind: 'rejected'; message: string; details: Record<string, string> };

export function outcomeOfFailure(error: unknown): UploadOutcome {
  if (!(error instanceof ApiError)) return { kind: 'rejected', message: 'The upload failed.', details: {} };
  if (error.code === 'duplicate_scan') {
    return { kind: 'duplicate', existingScanId: error.details['scanId'] ?? null, message: error.message };
  }
  return { kind: 'rejected', message: error.message, details: error.details };
}
