import type { ChartFormSummary } from '@shared/api/chart-forms';
import * as chartFormsRepository from '../chart-forms/chart-forms.repository';
import type { DbOrTrx } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import * as scansRepository from '../scans/scans.repository';
import type { ScanForTracing } from '../scans/scans.repository';

/** Only these scans may be traced: a traced one can be traced again (a second ink line). */
const TRACEABLE_STATUSES = ['ready_to_trace', 'traced'];

/** A scan that may be traced, with its chart form and chart start. */
export interface TraceableScan extends ScanForTracing {
  chartFormId: string;
  chartStart: Date;
  form: ChartFormSummary;
}

interface TraceOptions {
  /** Handing in stores series points under the scan's station, so it needs one; Follow ink does not. */
  needsStation?: boolean;
  /** Lock the scan's row for the rest of the transaction (hand-in changes its status). */
  forUpdate?: boolean;
}

/**
 * Loads a scan for Follow ink or a hand-in and checks it may be traced: 404 scan_not_found, 409
 * scan_not_traceable for its status, 409 scan_incomplete naming what it lacks, 404 when its chart form is gone.
 */
export async function loadTraceableScan(db: DbOrTrx, scanId: string, options: TraceOptions & { needsStation: true }): Promise<TraceableScan & { stationId: string }>;
export async function loadTraceableScan(db: DbOrTrx, scanId: string, options?: TraceOptions): Promise<TraceableScan>;
export async function loadTraceableScan(db: DbOrTrx, scanId: string, options: TraceOptions = {}): Promise<TraceableScan> {
  const scan = await scansRepository.findScanForTracing(db, scanId, { forUpdate: options.forUpdate ?? false });
  if (!scan) throw new AppError(HTTP.notFound, 'scan_not_found', 'There is no scan with this id.');
  if (!TRACEABLE_STATUSES.includes(scan.status)) {
    throw new AppError(HTTP.conflict, 'scan_not_traceable', `A scan that is ${scan.status.replace(/_/g, ' ')} cannot be traced.`);
  }
  const missing = [
    ...(options.needsStation && !scan.stationId ? ['stationId'] : []),
    ...(scan.chartFormId ? [] : ['chartFormId']),
    ...(scan.chartStart ? [] : ['chartStart']),
  ];
  if (missing.length > 0 || !scan.chartFormId || !scan.chartStart) {
    const words = missing.map((field) => ({ stationId: 'station', chartFormId: 'chart form', chartStart: 'chart start' })[field]);
    throw new AppError(HTTP.conflict, 'scan_incomplete', `This scan has no ${words.join(' or ')} yet; catalogue it before tracing.`, { missing });
  }
  const form = await chartFormsRepository.findChartFormById(db, scan.chartFormId);
  if (!form) throw new AppError(HTTP.notFound, 'chart_form_not_found', 'The chart form of this scan is missing.');
  return { ...scan, chartFormId: scan.chartFormId, chartStart: scan.chartStart, form };
}
