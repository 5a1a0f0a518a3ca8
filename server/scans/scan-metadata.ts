import type { ScanDetail, ScanMetadataInput } from '@shared/api/scans';
import type { Updateable } from 'kysely';
import type { AuditChanges } from '../audit/scan-audit.table';
import type { ScanTable } from './scan.table';

type EditableField = Exclude<keyof ScanMetadataInput, 'version'>;

const COLUMN_OF: Record<EditableField, keyof ScanTable> = {
  stationId: 'station_id',
  instrumentId: 'instrument_id',
  chartFormId: 'chart_form_id',
  chartStart: 'chart_start',
  chartOn: 'chart_on',
  chartOff: 'chart_off',
  observer: 'observer',
  collection: 'collection',
  box: 'box',
  folder: 'folder',
  item: 'item',
  conditionNotes: 'condition_notes',
  notes: 'notes',
  tags: 'tags',
  transcription: 'transcription',
  dpi: 'dpi',
};

const INSTANT_FIELDS = new Set<EditableField>(['chartStart', 'chartOn', 'chartOff']);

function isSame(before: unknown, after: unknown): boolean {
  return JSON.stringify(before) === JSON.stringify(after);
}

/** The columns a metadata patch changes and the audit record of it; fields sent with their current value are left out. */
export function diffScanMetadata(current: ScanDetail, patch: Omit<ScanMetadataInput, 'version'>): { columns: Updateable<ScanTable>; changes: AuditChanges } {
  const columns: Record<string, unknown> = {};
  const changes: AuditChanges = {};
  for (const field of Object.keys(COLUMN_OF) as EditableField[]) {
    const after = patch[field];
    if (after === undefined) continue;
    const before = current[field];
    if (isSame(before, after)) continue;
    changes[field] = { before, after };
    columns[COLUMN_OF[field]] = INSTANT_FIELDS.has(field) && after !== null ? new Date(after as string) : after;
  }
  return { columns: columns as Updateable<ScanTable>, changes };
}

/** Fields tracing depends on: once a scan is traced they change only after it is returned to ready to trace. */
export const TRACING_FIELDS: readonly EditableField[] = ['stationId', 'chartFormId', 'chartStart'];
