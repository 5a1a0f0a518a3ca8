import { chartStartFromFileName, compileFileNamePattern } from '@shared/api/file-name-pattern';
import type { ScanBulkEditInput, ScanSummary } from '@shared/api/scans';

/** What the archivist chose in the bulk edit panel; an empty value leaves that field as each scan has it. */
export interface BulkEditChoices {
  stationId: string;
  instrumentId: string;
  chartFormId: string;
  box: string;
  /** Comma-separated tags to add to each scan's own. */
  addTags: string;
  /** A file-name pattern such as `KRO_{yyyy}-{MM}-{dd}`; empty leaves chart starts alone. */
  fileNamePattern: string;
}

/** One scan's line in the preview: the chart start its file name gives, or null when the name does not match. */
export interface BulkEditPreviewRow {
  scanId: string;
  originalName: string;
  chartStart: string | null;
}

export type BulkEditPlan =
  | { kind: 'ready'; input: ScanBulkEditInput; preview: BulkEditPreviewRow[] }
  | { kind: 'problem'; message: string; preview: BulkEditPreviewRow[] };

/**
 * The request a bulk edit will send and its preview, computed as the archivist types so nothing is applied
 * unseen. A scan whose name the pattern does not match keeps its chart start (and says so in the preview).
 * Times read from file names are taken as UTC.
 */
export function planBulkEdit(scans: readonly ScanSummary[], choices: BulkEditChoices): BulkEditPlan {
  const pattern = choices.fileNamePattern.trim();
  const compiled = pattern === '' ? null : compileFileNamePattern(pattern);
  if (typeof compiled === 'string') return { kind: 'problem', message: `The file-name pattern: ${compiled}.`, preview: [] };
  const preview = compiled
    ? scans.map((scan): BulkEditPreviewRow => ({ scanId: scan.id, originalName: scan.originalName, chartStart: chartStartFromFileName(scan.originalName, compiled) }))
    : [];
  const set: ScanBulkEditInput['set'] = {};
  if (choices.stationId !== '') set.stationId = choices.stationId;
  if (choices.instrumentId !== '') set.instrumentId = choices.instrumentId;
  if (choices.chartFormId !== '') set.chartFormId = choices.chartFormId;
  if (choices.box.trim() !== '') set.box = choices.box.trim();
  const tags = choices.addTags
    .split(',')
    .map((tag) => tag.trim())
    .filter((tag) => tag !== '');
  if (tags.length > 0) set.addTags = [...new Set(tags)];
  const starts = new Map(preview.filter((row) => row.chartStart !== null).map((row) => [row.scanId, row.chartStart]));
  if (scans.length === 0) return { kind: 'problem', message: 'Select the scans to change first.', preview };
  if (Object.keys(set).length === 0 && starts.size === 0) {
    const message = compiled ? 'No selected file name matches the pattern, and no other field is set.' : 'Choose at least one field to set.';
    return { kind: 'problem', message, preview };
  }
  const input: ScanBulkEditInput = {
    scans: scans.map((scan) => (starts.has(scan.id) ? { id: scan.id, version: scan.version, chartStart: starts.get(scan.id) } : { id: scan.id, version: scan.version })),
    set,
  };
  return { kind: 'ready', input, preview };
}
