import { refuseUnknownKeys } from '@shared/api/field-reader';
import { readInstant } from '@shared/api/parse-instant';
import { normalizeTags } from '@shared/api/parse-scan-metadata';
import { SCAN_STATUSES, type ScanStatus } from '@shared/api/scans';
import { validationFailed } from '../errors/app-error';
import { parsePathId } from '../http/parse-body';
import { isUuid } from '../http/parse-query';
import type { ScanFilter } from './scans.repository';
import type { ParsedUploadFields } from './scans.service';

/** The form fields beside the file part of an upload. */
const UPLOAD_FIELDS = ['stationId', 'chartFormId', 'chartStart'];

function asRecord(body: unknown): Record<string, unknown> {
  return (typeof body === 'object' && body !== null ? body : {}) as Record<string, unknown>;
}

/** The issue-2 upload (POST /api/scans): station, chart form and chart start are all required. */
export function parseUploadFields(body: unknown, hasFile: boolean): Required<Omit<ParsedUploadFields, 'batchId'>> {
  const record = asRecord(body);
  const details: Record<string, string> = {};
  refuseUnknownKeys(record, UPLOAD_FIELDS, details);
  if (!hasFile) details['file'] = 'a scan file is required in the "file" part';
  if (!isUuid(record['stationId'])) details['stationId'] = 'stationId must be a station id';
  if (!isUuid(record['chartFormId'])) details['chartFormId'] = 'chartFormId must be a chart form id';
  const chartStart = readInstant(record['chartStart']);
  if (!chartStart.ok) details['chartStart'] = `chartStart ${chartStart.problem}`;
  if (!chartStart.ok || Object.keys(details).length > 0) throw validationFailed(details, 'The upload has invalid fields.');
  return {
    stationId: record['stationId'] as string,
    chartFormId: record['chartFormId'] as string,
    chartStart: new Date(chartStart.ms),
  };
}

/** An intake file's optional defaults (POST /api/intake/batches/:id/files); empty fields are absent. */
export function parseIntakeFields(body: unknown, hasFile: boolean): Omit<ParsedUploadFields, 'batchId'> {
  const record = asRecord(body);
  const details: Record<string, string> = {};
  const fields: Omit<ParsedUploadFields, 'batchId'> = {};
  refuseUnknownKeys(record, UPLOAD_FIELDS, details);
  if (!hasFile) details['file'] = 'a scan file is required in the "file" part';
  const present = (key: string) => record[key] !== undefined && record[key] !== '';
  if (present('stationId')) {
    if (isUuid(record['stationId'])) fields.stationId = record['stationId'];
    else details['stationId'] = 'stationId must be a station id';
  }
  if (present('chartFormId')) {
    if (isUuid(record['chartFormId'])) fields.chartFormId = record['chartFormId'];
    else details['chartFormId'] = 'chartFormId must be a chart form id';
  }
  if (present('chartStart')) {
    const chartStart = readInstant(record['chartStart']);
    if (!chartStart.ok) details['chartStart'] = `chartStart ${chartStart.problem}`;
    else fields.chartStart = new Date(chartStart.ms);
  }
  if (Object.keys(details).length > 0) throw validationFailed(details, 'The upload has invalid fields.');
  return fields;
}

function readId(query: Record<string, unknown>, key: string, details: Record<string, string>): string | undefined {
  const value = query[key];
  if (value === undefined || value === '') return undefined;
  if (isUuid(value)) return value;
  details[key] = `${key} must be an id`;
  return undefined;
}

function readFilterInstant(query: Record<string, unknown>, key: string, details: Record<string, string>): Date | undefined {
  const value = query[key];
  if (value === undefined || value === '') return undefined;
  // A bare date means that day from 00:00 UTC.
  const reading = readInstant(value, { allowDate: true });
  if (!reading.ok) {
    details[key] = `${key} ${reading.problem}, or a date such as 1931-03-02`;
    return undefined;
  }
  return new Date(reading.ms);
}

/** The catalogue filters of GET /api/scans and /api/scans/status-counts. */
/** The catalogue's filter parameters (GET /api/scans and its status counts). */
export const SCAN_FILTER_PARAMETERS = ['status', 'stationId', 'instrumentId', 'chartFormId', 'batchId', 'from', 'to', 'tag', 'q'] as const;

export function parseScanFilter(query: Record<string, unknown>): ScanFilter {
  const details: Record<string, string> = {};
  const filter: ScanFilter = {};
  const status = query['status'];
  if (status !== undefined && status !== '') {
    if (typeof status === 'string' && (SCAN_STATUSES as readonly string[]).includes(status)) filter.status = status as ScanStatus;
    else details['status'] = `status must be one of: ${SCAN_STATUSES.join(', ')}`;
  }
  filter.stationId = readId(query, 'stationId', details);
  filter.instrumentId = readId(query, 'instrumentId', details);
  filter.chartFormId = readId(query, 'chartFormId', details);
  filter.batchId = readId(query, 'batchId', details);
  filter.from = readFilterInstant(query, 'from', details);
  filter.to = readFilterInstant(query, 'to', details);
  if (filter.from && filter.to && filter.to < filter.from) details['to'] = 'to must not be before from';
  const tag = query['tag'];
  if (tag !== undefined) {
    const tags = Array.isArray(tag) ? tag : [tag];
    if (tags.some((item) => typeof item !== 'string' || item.length > 100)) details['tag'] = 'tag must be text of up to 100 characters';
    else filter.tags = normalizeTags(tags as string[]);
  }
  const q = query['q'];
  if (q !== undefined && q !== '') {
    if (typeof q !== 'string' || q.length > 200) details['q'] = 'q must be text of up to 200 characters';
    else filter.q = q.trim();
  }
  if (Object.keys(details).length > 0) throw validationFailed(details, 'The scan filters are invalid.');
  for (const key of Object.keys(filter) as (keyof ScanFilter)[]) if (filter[key] === undefined) delete filter[key];
  return filter;
}

/** A scan id from the path, or 404: a malformed id names no scan. */
export function parseScanId(value: unknown): string {
  return parsePathId(value, 'scan_not_found', 'scan');
}
