import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { ChartFormInput, ChartFormPatch, ChartFormSortKey, ChartFormSummary } from '@shared/api/chart-forms';
import { MAX_PAGE_SIZE, type Page, type PageQuery } from '@shared/api/paging';
import { API } from '@shared/api/routes';

import { toPageParams } from './page-params';

/** The library of printed chart types. */
@Injectable({ providedIn: 'root' })
export class ChartFormsApi {
  private readonly http = inject(HttpClient);

  /** Chart forms by name, as many as one page holds: enough for a select. */
  listForSelect(): Observable<Page<ChartFormSummary>> {
    return this.list({ page: 0, pageSize: MAX_PAGE_SIZE, sort: 'name', direction: 'asc' });
  }

  /** One page of the register. */
  list(query: PageQuery<ChartFormSortKey>): Observable<Page<ChartFormSummary>> {
    return this.http.get<Page<ChartFormSummary>>(API.chartForms, { params: toPageParams(query) });
  }

  get(chartFormId: string): Observable<ChartFormSummary> {
    return this.http.get<ChartFormSummary>(API.chartForm(chartFormId));
  }

  create(input: ChartFormInput): Observable<ChartFormSummary> {
    return this.http.post<ChartFormSummary>(API.chartForms, input);
  }

  /** A form already used by scans answers 409 conflict; a stale `version` 409 version_conflict. */
  update(chartFormId: string, patch: ChartFormPatch): Observable<ChartFormSummary> {
    return this.http.patch<ChartFormSummary>(API.chartForm(chartFormId), patch);
  }
}
