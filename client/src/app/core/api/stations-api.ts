import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { InstrumentInput, InstrumentPatch, InstrumentSummary } from '@shared/api/instruments';
import { MAX_PAGE_SIZE, type Page, type PageQuery } from '@shared/api/paging';
import { API } from '@shared/api/routes';
import type { StationInput, StationPatch, StationSortKey, StationSummary } from '@shared/api/stations';

import { toPageParams } from './page-params';

/** Stations and their instruments (the Archive's registers). */
@Injectable({ providedIn: 'root' })
export class StationsApi {
  private readonly http = inject(HttpClient);

  /** Stations by name, as many as one page holds: enough for a select. */
  listForSelect(): Observable<Page<StationSummary>> {
    return this.list({ page: 0, pageSize: MAX_PAGE_SIZE, sort: 'name', direction: 'asc' });
  }

  list(query: PageQuery<StationSortKey>): Observable<Page<StationSummary>> {
    return this.http.get<Page<StationSummary>>(API.stations, { params: toPageParams(query) });
  }

  get(stationId: string): Observable<StationSummary> {
    return this.http.get<StationSummary>(API.station(stationId));
  }

  create(input: StationInput): Observable<StationSummary> {
    return this.http.post<StationSummary>(API.stations, input);
  }

  /** A stale `version` answers 409 version_conflict. */
  update(stationId: string, patch: StationPatch): Observable<StationSummary> {
    return this.http.patch<StationSummary>(API.station(stationId), patch);
  }

  /** The station's instruments, by installation date, as many as one page holds. */
  instruments(stationId: string): Observable<Page<InstrumentSummary>> {
    const params = toPageParams({ page: 0, pageSize: MAX_PAGE_SIZE, sort: 'installedOn', direction: 'asc' });
    return this.http.get<Page<InstrumentSummary>>(API.stationInstruments(stationId), { params });
  }

  createInstrument(stationId: string, input: InstrumentInput): Observable<InstrumentSummary> {
    return this.http.post<InstrumentSummary>(API.stationInstruments(stationId), input);
  }

  updateInstrument(instrumentId: string, patch: InstrumentPatch): Observable<InstrumentSummary> {
    return this.http.patch<InstrumentSummary>(API.instrument(instrumentId), patch);
  }
}
