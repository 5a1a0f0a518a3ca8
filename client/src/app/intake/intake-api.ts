import { HttpClient, HttpEvent, HttpHeaders } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { IntakeBatch, IntakeBatchDetail, IntakeBatchSortKey, IntakeFileFields, IntakeFileResult, InventoryMatch } from '@shared/api/intake';
import type { Page, PageQuery } from '@shared/api/paging';
import { API } from '@shared/api/routes';

import { toPageParams } from '../core/api/page-params';

/** Intake batches: create one, send its files one request each (for per-file progress), import its inventory. */
@Injectable({ providedIn: 'root' })
export class IntakeApi {
  private readonly http = inject(HttpClient);

  createBatch(label: string): Observable<IntakeBatch> {
    return this.http.post<IntakeBatch>(API.intakeBatches, { label });
  }

  listBatches(query: PageQuery<IntakeBatchSortKey>): Observable<Page<IntakeBatch>> {
    return this.http.get<Page<IntakeBatch>>(API.intakeBatches, { params: toPageParams(query) });
  }

  getBatch(batchId: string): Observable<IntakeBatchDetail> {
    return this.http.get<IntakeBatchDetail>(API.intakeBatch(batchId));
  }

  /** One file as multipart `file` with the optional defaults; events carry upload progress, then the result. */
  sendFile(batchId: string, file: File, fields: IntakeFileFields = {}): Observable<HttpEvent<IntakeFileResult>> {
    const body = new FormData();
    if (fields.stationId) body.append('stationId', fields.stationId);
    if (fields.chartFormId) body.append('chartFormId', fields.chartFormId);
    if (fields.chartStart) body.append('chartStart', fields.chartStart);
    body.append('file', file, file.name);
    return this.http.post<IntakeFileResult>(API.intakeBatchFiles(batchId), body, { reportProgress: true, observe: 'events' });
  }

  /** The box inventory as CSV text; the answer lists matched rows, rows without a file and files without a row. */
  importInventory(batchId: string, csv: string): Observable<InventoryMatch> {
    const headers = new HttpHeaders({ 'Content-Type': 'text/csv; charset=utf-8' });
    return this.http.post<InventoryMatch>(API.intakeBatchInventory(batchId), csv, { headers });
  }
}
