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

/** State of a scan's derivatives (page raster, thumbnail, preview, IIIF tiles), made by the background worker. */
export const DERIVATIVE_STATES = ['queued', 'working', 'ready', 'failed'] as const;
export type DerivativeState = (typeof DERIVATIVE_STATES)[number];

export interface ScanSummary {
  id: string;
  /** Null while the scan's metadata has not been filled in (a scan may arrive before it). */
  stationId: string | null;
  stationName: string | null;
  chartFormId: string | null;
  chartFormName: string | null;
  /** ISO 8601 UTC: the nominal chart-on time, i.e. the time at the chart's left edge line; null until known. */
  chartStart: string | null;
  status: ScanStatus;
  /** File name as uploaded. */
  originalName: string;
  /** Media type of the master file, e.g. "image/tiff", "application/pdf". */
  mediaType: string;
  /** Size of the master file in bytes (shared by every page of a multi-page master). */
  sizeBytes: number;
  /** Pixel size of this page's raster. */
  widthPx: number;
  heightPx: number;
  /** Hex SHA-256 of the master file. */
  sha256: string;
  /** Page of the master this scan is, from 0 (a multi-page TIFF or PDF gives one scan per page). */
  pageIndex: number;
  /** Pages in the master file. */
  pageCount: number;
  /** ISO 8601 UTC. */
  uploadedAt: string;
  inkLineCount: number;
  derivativeState: DerivativeState;
  /** ISO 8601 UTC: chart-on time as written on the chart by the observer; null when not read. */
  chartOn: string | null;
  /** ISO 8601 UTC: chart-off time as written on the chart; null when not read. */
  chartOff: string | null;
  /** Free tags, lower case. */
  tags: string[];
  /** Optimistic-edit counter; send it back with a PATCH or a bulk edit. */
  version: number;
}

/** Everything the catalogue knows about one scan. */
export interface ScanDetail extends ScanSummary {
  instrumentId: string | null;
  /** Serial of the instrument, for display; null without an instrument. */
  instrumentSerial: string | null;
  /** Intake batch the scan arrived in; null for scans uploaded one by one. */
  batchId: string | null;
  /** Observer's name or initials as written. Empty string when none. */
  observer: string;
  /** Archival reference: collection / box / folder / item. Empty strings when unknown. */
  collection: string;
  box: string;
  folder: string;
  item: string;
  /** Condition of the paper: tears, stains, fading. */
  conditionNotes: string;
  /** The archivist's general notes (an inventory row's notes land here). */
  notes: string;
  /** Transcription of handwritten notes on the chart. */
  transcription: string;
  /** Why the scan was withdrawn; null unless status is withdrawn. */
  withdrawnReason: string | null;
  /** Scan resolution in dots per inch, from the file's metadata or typed by the archivist; null when unknown (ask). */
  dpi: number | null;
  /** EXIF orientation 1–8 from the file; null when the file carries none. */
  orientation: number | null;
  /** Why the last derivative job failed; null unless derivativeState is failed. */
  derivativeError: string | null;
  /** Derivative job attempts so far. */
  derivativeAttempts: number;
}

/** Body of PATCH /api/scans/:id: the catalogue fields to change plus the version last read (stale → 409 version_conflict). */
export interface ScanMetadataInput {
  version: number;
  stationId?: string | null;
  instrumentId?: string | null;
  chartFormId?: string | null;
  /** ISO 8601 UTC. */
  chartStart?: string | null;
  /** ISO 8601 UTC. */
  chartOn?: string | null;
  /** ISO 8601 UTC. */
  chartOff?: string | null;
  observer?: string;
  collection?: string;
  box?: string;
  folder?: string;
  item?: string;
  conditionNotes?: string;
  notes?: string;
  tags?: string[];
  transcription?: string;
  /** Dots per inch, > 0. */
  dpi?: number | null;
}

/** Body of POST /api/scans/:id/status. `reason` is required when status is withdrawn. */
export interface ScanStatusChange {
  status: ScanStatus;
  reason?: string;
}

/** Most scans one bulk edit may change (a large intake batch). */
export const MAX_BULK_EDIT_SCANS = 500;

/**
 * Body of POST /api/scans/bulk-edit: the same fields set on many scans at once, each scan at the version the
 * archivist read, and a chart start per scan (read from its file name, previewed before it is sent). Absent
 * fields are left alone; `addTags` are added to each scan's own tags.
 */
export interface ScanBulkEditInput {
  scans: { id: string; version: number; chartStart?: string | null }[];
  set: {
    stationId?: string | null;
    instrumentId?: string | null;
    chartFormId?: string | null;
    box?: string;
    addTags?: string[];
  };
}

/** Answer of a bulk edit: every scan as it now is. */
export interface ScanBulkEditResult {
  items: ScanDetail[];
}

/** What a change-log entry records. */
export const SCAN_CHANGE_ACTIONS = ['upload', 'edit', 'status', 'inventory', 'review'] as const;
export type ScanChangeAction = (typeof SCAN_CHANGE_ACTIONS)[number];

/**
 * One change-log entry: who changed what, when; `changes` maps a ScanDetail field name to its before and
 * after values. `names` gives the display name of every station, instrument, chart form and intake batch id
 * the entry mentions, so the log reads in names and not in ids.
 */
export interface ScanChangeLogEntry {
  id: string;
  /** ISO 8601 UTC. */
  at: string;
  personName: string;
  action: ScanChangeAction;
  changes: Record<string, { before: unknown; after: unknown }>;
  names: Record<string, string>;
}

/** Answer of GET /api/scans/status-counts: scans per status under the same filters as the catalogue. */
export type ScanStatusCounts = Record<ScanStatus, number>;

/** Catalogue filters of GET /api/scans and /api/scans/status-counts (query-string names). */
export interface ScanFilters {
  stationId?: string;
  /** ISO 8601 UTC; charts whose span [chartStart or chartOn, chartOff or chartStart + drum hours] overlaps [from, to]. */
  from?: string;
  to?: string;
  status?: ScanStatus;
  instrumentId?: string;
  chartFormId?: string;
  /** Repeatable: every tag given must be on the scan. */
  tag?: string[];
  /** Free text over file name, notes, transcription, observer, archival reference and tags (web-search syntax). */
  q?: string;
  batchId?: string;
}

/** Multipart fields sent with the `file` part of POST /api/scans (all three: the scan goes straight to ready_to_trace). */
export interface ScanUploadFields {
  stationId: string;
  chartFormId: string;
  chartStart: string;
}

export const SCAN_SORT_KEYS = ['chartStart', 'uploadedAt', 'stationName', 'status', 'originalName'] as const;
export type ScanSortKey = (typeof SCAN_SORT_KEYS)[number];
