/** An audited value as text: empty and null show as a dash, lists joined, everything else as JSON would write it. */
export function auditValueText(value: unknown): string {
  if (value === null || value === undefined || value === '') return '—';
  if (Array.isArray(value)) return value.length === 0 ? '—' : value.map((v) => auditValueText(v)).join(', ');
  if (typeof value === 'string') return value;
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

/** A ScanDetail field name as the audit trail shows it ("chartOn" → "chart on"). */
export function auditFieldLabel(field: string): string {
  return FIELD_LABELS[field] ?? field.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
}
