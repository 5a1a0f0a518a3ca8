import type { ScanDetail, ScanSummary } from '@shared/api/scans';
import type { DbOrTrx } from '../db/database';

/** The select every scan read shares: the scan, its station, form and instrument names, and its ink-line count. */
export function selectScans(db: DbOrTrx) {
  return db
    .selectFrom('scan')
    .leftJoin('station', 'station.id', 'scan.station_id')
    .leftJoin('chart_form', 'chart_form.id', 'scan.chart_form_id')
    .leftJoin('instrument', 'instrument.id', 'scan.instrument_id')
    .select((eb) => [
      'scan.id',
      'scan.station_id',
      'station.name as station_name',
      'scan.chart_form_id',
      'chart_form.name as chart_form_name',
      'scan.chart_start',
      'scan.status',
      'scan.original_name',
      'scan.media_type',
      'scan.size_bytes',
      'scan.width_px',
      'scan.height_px',
      'scan.sha256',
      'scan.page_index',
      'scan.page_count',
      'scan.uploaded_at',
      'scan.derivative_state',
      'scan.chart_on',
      'scan.chart_off',
      'scan.tags',
      'scan.instrument_id',
      'instrument.serial as instrument_serial',
      'scan.batch_id',
      'scan.observer',
      'scan.collection',
      'scan.box',
      'scan.folder',
      'scan.item',
      'scan.condition_notes',
      'scan.notes',
      'scan.transcription',
      'scan.withdrawn_reason',
      'scan.dpi',
      'scan.orientation',
      'scan.derivative_error',
      'scan.derivative_attempts',
      'scan.version',
      eb
        .selectFrom('ink_line')
        .select((inner) => inner.fn.countAll<number>().as('count'))
        .whereRef('ink_line.scan_id', '=', 'scan.id')
        // A draft is work in progress, not an ink line of the scan yet.
        .where('ink_line.status', '<>', 'draft')
        .as('ink_line_count'),
    ]);
}

export type ScanRow = Awaited<ReturnType<ReturnType<typeof selectScans>['executeTakeFirstOrThrow']>>;

const iso = (value: Date | null): string | null => (value ? value.toISOString() : null);

export function toScanSummary(row: ScanRow): ScanSummary {
  return {
    id: row.id,
    stationId: row.station_id,
    stationName: row.station_name,
    chartFormId: row.chart_form_id,
    chartFormName: row.chart_form_name,
    chartStart: iso(row.chart_start),
    status: row.status,
    originalName: row.original_name,
    mediaType: row.media_type,
    sizeBytes: row.size_bytes,
    widthPx: row.width_px,
    heightPx: row.height_px,
    sha256: row.sha256,
    pageIndex: row.page_index,
    pageCount: row.page_count,
    uploadedAt: row.uploaded_at.toISOString(),
    inkLineCount: Number(row.ink_line_count ?? 0),
    derivativeState: row.derivative_state,
    chartOn: iso(row.chart_on),
    chartOff: iso(row.chart_off),
    tags: row.tags,
    version: row.version,
  };
}

export function toScanDetail(row: ScanRow): ScanDetail {
  return {
    ...toScanSummary(row),
    instrumentId: row.instrument_id,
    instrumentSerial: row.instrument_serial,
    batchId: row.batch_id,
    observer: row.observer,
    collection: row.collection,
    box: row.box,
    folder: row.folder,
    item: row.item,
    conditionNotes: row.condition_notes,
    notes: row.notes,
    transcription: row.transcription,
    withdrawnReason: row.withdrawn_reason,
    dpi: row.dpi,
    orientation: row.orientation,
    derivativeError: row.derivative_error,
    derivativeAttempts: row.derivative_attempts,
  };
}
