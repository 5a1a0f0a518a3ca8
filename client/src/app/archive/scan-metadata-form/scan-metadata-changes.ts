import type { ScanDetail, ScanMetadataInput } from '@shared/api/scans';

import { normalizeInstant } from '@shared/api/parse-instant';

/** The form's raw text values. */
export interface ScanMetadataValues {
  stationId: string;
  instrumentId: string;
  chartFormId: string;
  chartStart: string;
  chartOn: string;
  chartOff: string;
  observer: string;
  collection: string;
  box: string;
  folder: string;
  item: string;
  dpi: string;
  tags: string;
  conditionNotes: string;
  notes: string;
  transcription: string;
}

/** An instant as the form shows it: ISO 8601 UTC to the minute, e.g. 2026-03-02T00:00Z. */
export function instantText(iso: string | null): string {
  return iso ? `${iso.slice(0, 16)}Z` : '';
}

export function valuesOfScan(scan: ScanDetail): ScanMetadataValues {
  return {
    stationId: scan.stationId ?? '',
    instrumentId: scan.instrumentId ?? '',
    chartFormId: scan.chartFormId ?? '',
    chartStart: instantText(scan.chartStart),
    chartOn: instantText(scan.chartOn),
    chartOff: instantText(scan.chartOff),
    observer: scan.observer,
    collection: scan.collection,
    box: scan.box,
    folder: scan.folder,
    item: scan.item,
    dpi: scan.dpi === null ? '' : String(scan.dpi),
    tags: scan.tags.join(', '),
    conditionNotes: scan.conditionNotes,
    notes: scan.notes,
    transcription: scan.transcription,
  };
}

/** Tags typed as "storm, torn corner" → ["storm", "torn corner"], lower case, without repeats. */
export function parseTags(text: string): string[] {
  const tags = text
    .split(',')
    .map((tag) => tag.trim().toLowerCase())
    .filter((tag) => tag !== '');
  return [...new Set(tags)];
}

/**
 * Only the fields the archivist changed, plus the version they read, so that two people editing different
 * fields of one scan still get a clear 409 rather than one silently undoing the other.
 */
export function scanMetadataChanges(scan: ScanDetail, values: ScanMetadataValues): ScanMetadataInput {
  const before = valuesOfScan(scan);
  const input: ScanMetadataInput = { version: scan.version };
  const idOrNull = (text: string) => (text === '' ? null : text);
  const instantOrNull = (text: string) => (text.trim() === '' ? null : normalizeInstant(text));
  if (values.stationId !== before.stationId) input.stationId = idOrNull(values.stationId);
  if (values.instrumentId !== before.instrumentId) input.instrumentId = idOrNull(values.instrumentId);
  if (values.chartFormId !== before.chartFormId) input.chartFormId = idOrNull(values.chartFormId);
  if (values.chartStart.trim() !== before.chartStart) input.chartStart = instantOrNull(values.chartStart);
  if (values.chartOn.trim() !== before.chartOn) input.chartOn = instantOrNull(values.chartOn);
  if (values.chartOff.trim() !== before.chartOff) input.chartOff = instantOrNull(values.chartOff);
  for (const key of ['observer', 'collection', 'box', 'folder', 'item', 'conditionNotes', 'notes', 'transcription'] as const) {
    if (values[key] !== before[key]) input[key] = values[key];
  }
  if (values.dpi.trim() !== before.dpi) input.dpi = values.dpi.trim() === '' ? null : Number(values.dpi);
  const tags = parseTags(values.tags);
  if (tags.join('\u0000') !== scan.tags.join('\u0000')) input.tags = tags;
  return input;
}
