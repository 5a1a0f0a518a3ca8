import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page, PageQuery } from '@shared/api/paging';
import type { InkLineDecisionResult, ReviewDetail, ReviewFilters, ReviewRow } from '@shared/api/review';
import type { ProgressGroup, TracingProgressRow } from '@shared/api/desk';
import { API } from '@shared/api/routes';

import { toPageParams } from '../core/api/page-params';

/** The archivist's Review: handed-in ink lines, their decisions, and tracing progress. */
@Injectable({ providedIn: 'root' })
export class ReviewApi {
  private readonly http = inject(HttpClient);

  list(query: PageQuery, filters: ReviewFilters): Observable<Page<ReviewRow>> {
    return this.http.get<Page<ReviewRow>>(API.review, { params: toPageParams(query, { ...filters }) });
  }

  detail(inkLineId: string): Observable<ReviewDetail> {
    return this.http.get<ReviewDetail>(API.inkLineReview(inkLineId));
  }

  approve(inkLineId: string, version: number): Observable<InkLineDecisionResult> {
    return this.http.post<InkLineDecisionResult>(API.inkLineApprove(inkLineId), { version });
  }

  giveBack(inkLineId: string, version: number, note: string): Observable<InkLineDecisionResult> {
    return this.http.post<InkLineDecisionResult>(API.inkLineReturn(inkLineId), { version, note });
  }

  progress(query: PageQuery, groupBy: ProgressGroup): Observable<Page<TracingProgressRow>> {
    return this.http.get<Page<TracingProgressRow>>(API.tracingProgress, { params: toPageParams(query, { groupBy }) });
  }
}
