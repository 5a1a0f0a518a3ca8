import { SCAN_STATUS_LABELS, SCAN_STATUSES, type ScanStatus } from '@shared/api/scans';

function isScanStatus(value: string): value is ScanStatus {
  return (SCAN_STATUSES as readonly string[]).includes(value);
}

/**
 * A logged value as the archivist reads it: an id as the name the server sent with the entry, a status in
 * words, empty and null as a dash, lists joined, everything else as JSON would write it.
 */
export function changeLogValueText(value: unknown, field = '', names: Readonly<Record<string, string>> = {}): string {
  if (value === null || value === undefined || value === '') return '—';
  if (Array.isArray(value)) return value.length === 0 ? '—' : value.map((v) => changeLogValueText(v, field, names)).join(', ');
  if (typeof value === 'string') {
    if (names[value]) return names[value];
    if (field === 'status' && isScanStatus(value)) return SCAN_STATUS_LABELS[value];
    return value;
  }
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  return JSON.stringify(value);
}

const FIELD_LABELS: Readonly<Record<string, string>> = {
  stationId: 'station',
  instrumentId: 'instrument',
  chartFormId: 'chart form',
  chartStart: 'chart start',
  chartOn: 'chart on',
  chartOff: 'chart off',
  conditionNotes: 'condition notes',
  withdrawnReason: 'withdrawn because',
  originalName: 'file name',
  pageIndex: 'page (from 0)',
  pageCount: 'pages',
  batchId: 'intake batch',
  dpi: 'dpi',
};

/** A ScanDetail field name as the change log shows it ("chartOn" → "chart on"). */
export function changeLogFieldLabel(field: string): string {
  return FIELD_LABELS[field] ?? field.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
}
