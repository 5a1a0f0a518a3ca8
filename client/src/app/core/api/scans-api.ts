import { HttpClient, HttpEvent } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page, PageQuery } from '@shared/api/paging';
import { API } from '@shared/api/routes';
import type { ScanDetail, ScanSortKey, ScanStatus, ScanSummary, ScanUploadFields } from '@shared/api/scans';

import { toPageParams } from './page-params';

export interface ScanFilters {
  status?: ScanStatus;
  stationId?: string;
}

/** The catalogue of scans: used by the Archive (catalogue, upload), the Desk and the Bench. */
@Injectable({ providedIn: 'root' })
export class ScansApi {
  private readonly http = inject(HttpClient);

  list(query: PageQuery<ScanSortKey>, filters: ScanFilters = {}): Observable<Page<ScanSummary>> {
    return this.http.get<Page<ScanSummary>>(API.scans, { params: toPageParams(query, { ...filters }) });
  }

  get(scanId: string): Observable<ScanDetail> {
    return this.http.get<ScanDetail>(API.scan(scanId));
  }

  /** The server's downscaled JPEG, as a Blob so the bearer token travels with the request. */
  preview(scanId: string): Observable<Blob> {
    return this.http.get(API.scanPreview(scanId), { responseType: 'blob' });
  }

  /** Uploads one scan; the events carry upload progress and end with the stored ScanDetail. */
  upload(file: File, fields: ScanUploadFields): Observable<HttpEvent<ScanDetail>> {
    const body = new FormData();
    body.append('stationId', fields.stationId);
    body.append('chartFormId', fields.chartFormId);
    body.append('periodStart', fields.periodStart);
    body.append('file', file, file.name);
    return this.http.post<ScanDetail>(API.scans, body, { reportProgress: true, observe: 'events' });
  }
}
