import type { ApiErrorCode } from './errors';
import type { ScanSummary } from './scans';

/** What became of one uploaded file. */
export const INTAKE_OUTCOMES = ['stored', 'duplicate', 'rejected'] as const;
export type IntakeOutcome = (typeof INTAKE_OUTCOMES)[number];

export interface IntakeCounts {
  stored: number;
  duplicate: number;
  rejected: number;
}

/** Body of POST /api/intake/batches. */
export interface IntakeBatchInput {
  /** The archivist's name for the batch, e.g. "Box 14, Krovik 1931". */
  label: string;
}

export interface IntakeBatch {
  id: string;
  label: string;
  /** ISO 8601 UTC. */
  createdAt: string;
  createdByName: string;
  /** Files sent to the batch so far, whatever their outcome. */
  fileCount: number;
  counts: IntakeCounts;
  /** True once an inventory CSV has been imported. */
  hasInventory: boolean;
}

/** One file sent to a batch, as the batch summary lists it. */
export interface IntakeFileRecord {
  fileName: string;
  outcome: IntakeOutcome;
  /** Why it was rejected or is a duplicate; null when stored. */
  reason: string | null;
  code: ApiErrorCode | null;
  /** Scans the file gave (stored) or matched (duplicate). */
  scanIds: string[];
  /** ISO 8601 UTC. */
  at: string;
}

export interface IntakeBatchDetail extends IntakeBatch {
  files: IntakeFileRecord[];
  scans: ScanSummary[];
}

/** Optional multipart fields sent with the `file` part of POST /api/intake/batches/:id/files. */
export interface IntakeFileFields {
  stationId?: string;
  chartFormId?: string;
  /** ISO 8601 UTC. */
  chartStart?: string;
}

/**
 * Answer of POST /api/intake/batches/:id/files when the file is stored (201). A duplicate answers 409 and a
 * rejected file 4xx, both with the usual ApiErrorBody (a duplicate's `details` carry `existingScanId`);
 * either way the file is recorded in the batch summary.
 */
export interface IntakeFileResult {
  fileName: string;
  outcome: IntakeOutcome;
  reason?: string;
  code?: ApiErrorCode;
  scans: ScanSummary[];
  /** For a duplicate: the scan already holding these bytes. */
  existingScanId?: string;
}

/** Header names of an inventory CSV, in any order, case-insensitive (extra columns are ignored). */
export const INVENTORY_COLUMNS = ['file name', 'station', 'chart on', 'chart off', 'box', 'folder', 'notes'] as const;
export type InventoryColumn = (typeof INVENTORY_COLUMNS)[number];
/** Further header names an inventory may carry; only `file name` is required, unknown columns are ignored. */
export const INVENTORY_OPTIONAL_COLUMNS = ['collection', 'item', 'observer', 'tags'] as const;

/** A row of the inventory matched to a file of the batch. */
export interface InventoryMatchedRow {
  line: number;
  fileName: string;
  /** The file's scans (one per page); for a file refused as a duplicate, the scans already holding its bytes. */
  scanIds: string[];
  /** Set when the row names a file refused as a duplicate: the scan (first page) already holding its bytes. The row's metadata was applied to no scan. */
  duplicateOf?: string;
  /** For such a row, a sentence for the archivist naming that scan, where it was stored, and that nothing was filled. */
  note?: string;
}

/** Answer of POST /api/intake/batches/:id/inventory (body text/csv). `line` counts from 1 at the header row. */
export interface InventoryMatch {
  matched: InventoryMatchedRow[];
  rowsWithoutFile: { line: number; fileName: string }[];
  filesWithoutRow: { fileName: string; scanIds: string[] }[];
}

export const INTAKE_BATCH_SORT_KEYS = ['createdAt', 'label'] as const;
export type IntakeBatchSortKey = (typeof INTAKE_BATCH_SORT_KEYS)[number];
