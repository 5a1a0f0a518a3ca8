import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import { API } from '@shared/api/routes';
import type { SeriesResponse } from '@shared/api/series';

import type { SeriesRange } from './series-range';

/** Station series reads: the points as JSON for the plot, and the same range as CSV. */
@Injectable({ providedIn: 'root' })
export class SeriesApi {
  private readonly http = inject(HttpClient);

  get(range: SeriesRange): Observable<SeriesResponse> {
    return this.http.get<SeriesResponse>(API.series, { params: toSeriesParams(range) });
  }

  /** The CSV as a Blob (fetched through HttpClient so the token is sent). */
  getCsv(range: SeriesRange): Observable<Blob> {
    return this.http.get(API.seriesCsv, { params: toSeriesParams(range), responseType: 'blob' });
  }
}

/** stationId plus from/to as the UTC days typed (YYYY-MM-DD); the server reads a `to` day as included whole. */
export function toSeriesParams(range: SeriesRange): HttpParams {
  return new HttpParams().set('stationId', range.stationId).set('from', range.fromDay).set('to', range.toDay);
}
