import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { ChartFormSummary } from '@shared/api/chart-forms';
import { MAX_PAGE_SIZE, type Page } from '@shared/api/paging';
import { API } from '@shared/api/routes';

import { toPageParams } from './page-params';

@Injectable({ providedIn: 'root' })
export class ChartFormsApi {
  private readonly http = inject(HttpClient);

  /** Chart forms by name, as many as one page holds: enough for a select. */
  listForSelect(): Observable<Page<ChartFormSummary>> {
    const params = toPageParams({ page: 0, pageSize: MAX_PAGE_SIZE, sort: 'name', direction: 'asc' });
    return this.http.get<Page<ChartFormSummary>>(API.chartForms, { params });
  }
}
