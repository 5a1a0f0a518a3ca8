import { SCAN_STATUSES, type ScanStatus } from '@shared/api/scans';
import { AppError, HTTP, validationFailed } from '../errors/app-error';
import { isUuid } from '../http/parse-query';
import { parseInstantMs } from '../http/parse-time';
import type { ScanFilter } from './scans.repository';
import type { ParsedUploadFields } from './scans.service';

export function parseUploadFields(body: unknown, hasFile: boolean): ParsedUploadFields {
  const record = (typeof body === 'object' && body !== null ? body : {}) as Record<string, unknown>;
  const details: Record<string, string> = {};
  if (!hasFile) details['file'] = 'a scan file is required in the "file" part';
  if (!isUuid(record['stationId'])) details['stationId'] = 'stationId must be a station id';
  if (!isUuid(record['chartFormId'])) details['chartFormId'] = 'chartFormId must be a chart form id';
  const periodStartMs = parseInstantMs(record['periodStart']);
  if (periodStartMs === null) details['periodStart'] = 'periodStart must be an ISO 8601 UTC instant, e.g. 2026-03-02T00:00Z';
  if (Object.keys(details).length > 0) throw validationFailed(details, 'The upload has invalid fields.');
  return {
    stationId: record['stationId'] as string,
    chartFormId: record['chartFormId'] as string,
    periodStart: new Date(periodStartMs as number),
  };
}

export function parseScanFilter(query: Record<string, unknown>): ScanFilter {
  const details: Record<string, string> = {};
  const filter: ScanFilter = {};
  const status = query['status'];
  if (status !== undefined && status !== '') {
    if (typeof status === 'string' && (SCAN_STATUSES as readonly string[]).includes(status)) filter.status = status as ScanStatus;
    else details['status'] = `status must be one of: ${SCAN_STATUSES.join(', ')}`;
  }
  const stationId = query['stationId'];
  if (stationId !== undefined && stationId !== '') {
    if (isUuid(stationId)) filter.stationId = stationId;
    else details['stationId'] = 'stationId must be a station id';
  }
  if (Object.keys(details).length > 0) throw validationFailed(details, 'The scan filters are invalid.');
  return filter;
}

/** A scan id from the path, or 404: a malformed id names no scan. */
export function parseScanId(value: unknown): string {
  if (!isUuid(value)) throw new AppError(HTTP.notFound, 'scan_not_found', 'There is no scan with this id.');
  return value;
}
