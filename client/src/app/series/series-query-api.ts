import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import { API } from '@shared/api/routes';
import type { PointChart } from '@shared/api/series-point-chart';
import type { SeriesFormat, SeriesQueryResponse, SeriesStep, StationCoverage } from '@shared/api/series-query';

/** A query of the Series page: stations, an inclusive range of UTC instants (epoch ms) and a step. */
export interface SeriesView {
  stationIds: readonly string[];
  fromMs: number;
  toMs: number;
  step: SeriesStep;
}

/** The query parameters of GET /api/series/query for a view and format (mean buckets; every flag). */
export function toQueryParams(view: SeriesView, format: SeriesFormat): HttpParams {
  return new HttpParams()
    .set('stationId', view.stationIds.join(','))
    .set('from', new Date(view.fromMs).toISOString())
    .set('to', new Date(view.toMs).toISOString())
    .set('step', view.step)
    .set('format', format);
}

/** The Series page's reads: coverage, the series at a step, its downloads, and a point's chart. */
@Injectable({ providedIn: 'root' })
export class SeriesQueryApi {
  private readonly http = inject(HttpClient);

  coverage(stationId: string): Observable<StationCoverage> {
    return this.http.get<StationCoverage>(API.stationCoverage(stationId));
  }

  query(view: SeriesView): Observable<SeriesQueryResponse> {
    return this.http.get<SeriesQueryResponse>(API.seriesQuery, { params: toQueryParams(view, 'json') });
  }

  /** The same view as a file (fetched through HttpClient so the token is sent). */
  download(view: SeriesView, format: SeriesFormat): Observable<Blob> {
    return this.http.get(API.seriesQuery, { params: toQueryParams(view, format), responseType: 'blob' });
  }

  pointChart(stationId: string, timeMs: number): Observable<PointChart> {
    return this.http.get<PointChart>(API.seriesPointChart, { params: new HttpParams().set('stationId', stationId).set('time', new Date(timeMs).toISOString()) });
  }

  /** A IIIF image request as a Blob (the image routes need the bearer token). */
  image(path: string): Observable<Blob> {
    return this.http.get(path, { responseType: 'blob' });
  }
}
