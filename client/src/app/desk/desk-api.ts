import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { DeskLine, DeskSection, DeskSummary, NextChartResult } from '@shared/api/desk';
import type { Page, PageQuery } from '@shared/api/paging';
import type { InkLineDecisionResult } from '@shared/api/review';
import { API } from '@shared/api/routes';

import { toPageParams } from '../core/api/page-params';

/** The volunteer's Desk: the queue's next chart, the claim, and the volunteer's own lines by section. */
@Injectable({ providedIn: 'root' })
export class DeskApi {
  private readonly http = inject(HttpClient);

  summary(): Observable<DeskSummary> {
    return this.http.get<DeskSummary>(API.deskSummary);
  }

  lines(section: DeskSection, query: PageQuery): Observable<Page<DeskLine>> {
    return this.http.get<Page<DeskLine>>(API.deskLines, { params: toPageParams(query, { section }) });
  }

  takeNext(): Observable<NextChartResult> {
    return this.http.post<NextChartResult>(API.deskNext, {});
  }

  giveBack(scanId: string): Observable<void> {
    return this.http.delete<void>(API.deskClaim(scanId));
  }

  rework(inkLineId: string, version: number): Observable<InkLineDecisionResult> {
    return this.http.post<InkLineDecisionResult>(API.inkLineRework(inkLineId), { version });
  }
}
