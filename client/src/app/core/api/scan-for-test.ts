import type { ScanDetail, ScanSummary } from '@shared/api/scans';

/** A catalogued scan of an invented station for specs; override what the spec is about. */
export function scanSummaryForTest(overrides: Partial<ScanSummary> = {}): ScanSummary {
  return {
    id: 'scan-1',
    stationId: 'st-kro',
    stationName: 'Kestrel Ridge Observatory',
    chartFormId: 'cf-1',
    chartFormName: 'Weekly 950–1050 hPa',
    chartStart: '2026-03-02T00:00:00.000Z',
    status: 'ready_to_trace',
    originalName: 'kro-week-10.png',
    mediaType: 'image/png',
    sizeBytes: 1000,
    widthPx: 4800,
    heightPx: 1600,
    sha256: 'ab'.repeat(32),
    pageIndex: 0,
    pageCount: 1,
    uploadedAt: '2026-03-10T09:00:00.000Z',
    inkLineCount: 0,
    derivativeState: 'ready',
    chartOn: null,
    chartOff: null,
    tags: [],
    ...overrides,
  };
}

export function scanDetailForTest(overrides: Partial<ScanDetail> = {}): ScanDetail {
  return {
    ...scanSummaryForTest(),
    instrumentId: null,
    instrumentSerial: null,
    batchId: null,
    observer: '',
    collection: '',
    box: '',
    folder: '',
    item: '',
    conditionNotes: '',
    notes: '',
    transcription: '',
    withdrawnReason: null,
    dpi: 150,
    orientation: null,
    derivativeError: null,
    derivativeAttempts: 1,
    version: 3,
    ...overrides,
  };
}
