import { HttpClient, HttpEvent, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page, PageQuery } from '@shared/api/paging';
import { API, IIIF } from '@shared/api/routes';
import type {
  ScanBulkEditInput,
  ScanBulkEditResult,
  ScanChangeLogEntry,
  ScanDetail,
  ScanFilters,
  ScanMetadataInput,
  ScanSortKey,
  ScanStatusChange,
  ScanStatusCounts,
  ScanSummary,
  ScanUploadFields,
} from '@shared/api/scans';

import { toPageParams } from './page-params';

/** Query parameters for the catalogue filters; `tag` repeats, empty values are left out. */
export function scanFilterParams(filters: ScanFilters, params = new HttpParams()): HttpParams {
  let result = params;
  for (const [key, value] of Object.entries(filters) as [keyof ScanFilters, ScanFilters[keyof ScanFilters]][]) {
    if (Array.isArray(value)) {
      for (const item of value) if (item !== '') result = result.append(key, item);
    } else if (value !== undefined && value !== null && value !== '') {
      result = result.set(key, value);
    }
  }
  return result;
}

/** The catalogue of scans: used by the Archive (catalogue, intake, scan page), the Desk and the Bench. */
@Injectable({ providedIn: 'root' })
export class ScansApi {
  private readonly http = inject(HttpClient);

  list(query: PageQuery<ScanSortKey>, filters: ScanFilters = {}): Observable<Page<ScanSummary>> {
    return this.http.get<Page<ScanSummary>>(API.scans, { params: scanFilterParams(filters, toPageParams(query)) });
  }

  statusCounts(filters: ScanFilters = {}): Observable<ScanStatusCounts> {
    return this.http.get<ScanStatusCounts>(API.scanStatusCounts, { params: scanFilterParams(filters) });
  }

  get(scanId: string): Observable<ScanDetail> {
    return this.http.get<ScanDetail>(API.scan(scanId));
  }

  /** Saves catalogue fields; a stale `version` answers 409 version_conflict. */
  update(scanId: string, input: ScanMetadataInput): Observable<ScanDetail> {
    return this.http.patch<ScanDetail>(API.scan(scanId), input);
  }

  /** Sets the same fields on many scans at once; any stale version refuses the whole edit (409). */
  bulkEdit(input: ScanBulkEditInput): Observable<ScanBulkEditResult> {
    return this.http.post<ScanBulkEditResult>(API.scanBulkEdit, input);
  }

  changeStatus(scanId: string, change: ScanStatusChange): Observable<ScanDetail> {
    return this.http.post<ScanDetail>(API.scanStatus(scanId), change);
  }

  changeLog(scanId: string, query: PageQuery): Observable<Page<ScanChangeLogEntry>> {
    return this.http.get<Page<ScanChangeLogEntry>>(API.scanChangeLog(scanId), { params: toPageParams(query) });
  }

  retryDerivatives(scanId: string): Observable<ScanDetail> {
    return this.http.post<ScanDetail>(API.scanDerivativesRetry(scanId), {});
  }

  /** The server's downscaled JPEG, as a Blob so the bearer token travels with the request. */
  preview(scanId: string): Observable<Blob> {
    return this.http.get(API.scanPreview(scanId), { responseType: 'blob' });
  }

  /** The scan's IIIF Image API 3.0 info.json, fetched with the token (viewers then fetch tiles themselves). */
  iiifInfo(scanId: string): Observable<Record<string, unknown>> {
    return this.http.get<Record<string, unknown>>(IIIF.info(scanId));
  }

  /** A IIIF image of the whole scan fitted inside `longestSidePx`, as a Blob (the token travels with it). */
  iiifImage(scanId: string, longestSidePx: number): Observable<Blob> {
    return this.http.get(IIIF.image(scanId, 'full', `!${longestSidePx},${longestSidePx}`), { responseType: 'blob' });
  }

  /** Uploads one scan; the events carry upload progress and end with the stored ScanDetail. */
  upload(file: File, fields: ScanUploadFields): Observable<HttpEvent<ScanDetail>> {
    const body = new FormData();
    body.append('stationId', fields.stationId);
    body.append('chartFormId', fields.chartFormId);
    body.append('chartStart', fields.chartStart);
    body.append('file', file, file.name);
    return this.http.post<ScanDetail>(API.scans, body, { reportProgress: true, observe: 'events' });
  }
}
