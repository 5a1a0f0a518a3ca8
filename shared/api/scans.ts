/** Catalogue states of a scan (see GLOSSARY.md). */
export const SCAN_STATUSES = ['received', 'ready_to_trace', 'traced', 'approved', 'withdrawn'] as const;
export type ScanStatus = (typeof SCAN_STATUSES)[number];

export const SCAN_STATUS_LABELS: Record<ScanStatus, string> = {
  received: 'received',
  ready_to_trace: 'ready to trace',
  traced: 'traced',
  approved: 'approved',
  withdrawn: 'withdrawn',
};

export interface ScanSummary {
  id: string;
  stationId: string;
  stationName: string;
  chartFormId: string;
  chartFormName: string;
  /** ISO 8601 UTC: the nominal chart-on time, i.e. the time at the chart's left edge line. */
  periodStart: string;
  status: ScanStatus;
  originalName: string;
  mediaType: string;
  sizeBytes: number;
  widthPx: number;
  heightPx: number;
  sha256: string;
  uploadedAt: string;
  inkLineCount: number;
}

export type ScanDetail = ScanSummary;

/** Multipart fields sent with the `file` part of an upload. */
export interface ScanUploadFields {
  stationId: string;
  chartFormId: string;
  periodStart: string;
}

export const SCAN_SORT_KEYS = ['periodStart', 'uploadedAt', 'stationName', 'status', 'originalName'] as const;
export type ScanSortKey = (typeof SCAN_SORT_KEYS)[number];
