import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { StationTracing, TracePriority, TracePriorityInput } from '@shared/api/desk';
import { API } from '@shared/api/routes';

/** The archivist's tracing settings: how many lines a station's charts need, and the Desk queue's priorities. */
@Injectable({ providedIn: 'root' })
export class TracingApi {
  private readonly http = inject(HttpClient);

  stationTracing(stationId: string): Observable<StationTracing> {
    return this.http.get<StationTracing>(API.stationTracing(stationId));
  }

  setStationTracing(stationId: string, inkLinesRequired: 1 | 2): Observable<StationTracing> {
    return this.http.put<StationTracing>(API.stationTracing(stationId), { inkLinesRequired });
  }

  setPriority(input: TracePriorityInput): Observable<TracePriority> {
    return this.http.put<TracePriority>(API.tracingPriorities, input);
  }
}
