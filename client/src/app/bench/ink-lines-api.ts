import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { BenchWork } from '@shared/api/bench-work';
import type { DraftSaved, InkLineDraft, InkLineSaved, MyInkLine, MyInkLineSummary } from '@shared/api/ink-lines';
import type { Page, PageQuery } from '@shared/api/paging';
import { API } from '@shared/api/routes';

import { toPageParams } from '../core/api/page-params';
import { AuthSession } from '../core/auth/auth-session';
import { toApiError } from '../core/http/api-error';

@Injectable({ providedIn: 'root' })
export class InkLinesApi {
  private readonly http = inject(HttpClient);
  private readonly session = inject(AuthSession);

  /** Hands in a trace; pixels are full-resolution scan pixels. */
  handIn(scanId: string, draft: InkLineDraft): Observable<InkLineSaved> {
    return this.http.post<InkLineSaved>(API.scanInkLines(scanId), draft);
  }

  /** Autosaves the caller's draft; version null starts it. */
  saveDraft(scanId: string, version: number | null, work: BenchWork): Observable<DraftSaved> {
    return this.http.put<DraftSaved>(API.scanDraft(scanId), { version, work });
  }

  /**
   * The same save sent while the page is being left: fetch with keepalive outlives the page, which an
   * HttpClient request does not. If the page lives on (a hidden tab), the answer is read as usual.
   */
  async saveDraftOnLeave(scanId: string, version: number | null, work: BenchWork): Promise<DraftSaved> {
    const token = this.session.token();
    const response = await fetch(API.scanDraft(scanId), {
      method: 'PUT',
      keepalive: true,
      headers: { 'Content-Type': 'application/json', ...(token ? { Authorization: `Bearer ${token}` } : {}) },
      body: JSON.stringify({ version, work }),
    });
    const body: unknown = await response.json();
    if (!response.ok) throw toApiError(new HttpErrorResponse({ status: response.status, statusText: response.statusText }), body);
    return body as DraftSaved;
  }

  /** The caller's own line on the scan (their draft first), or null. */
  mine(scanId: string): Observable<{ inkLine: MyInkLine | null }> {
    return this.http.get<{ inkLine: MyInkLine | null }>(API.scanMyInkLine(scanId));
  }

  /** "My drafts": the caller's drafts, last touched first. */
  myDrafts(query: PageQuery): Observable<Page<MyInkLineSummary>> {
    return this.http.get<Page<MyInkLineSummary>>(API.myInkLines, { params: toPageParams(query, { status: 'draft' }) });
  }
}
