import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import { MAX_PAGE_SIZE, type Page } from '@shared/api/paging';
import { API } from '@shared/api/routes';
import type { StationSummary } from '@shared/api/stations';

import { toPageParams } from './page-params';

@Injectable({ providedIn: 'root' })
export class StationsApi {
  private readonly http = inject(HttpClient);

  /** Stations by name, as many as one page holds: enough for a select. */
  listForSelect(): Observable<Page<StationSummary>> {
    const params = toPageParams({ page: 0, pageSize: MAX_PAGE_SIZE, sort: 'name', direction: 'asc' });
    return this.http.get<Page<StationSummary>>(API.stations, { params });
  }
}
