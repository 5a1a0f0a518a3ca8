import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { InkLineDraft, InkLineSaved } from '@shared/api/ink-lines';
import { API } from '@shared/api/routes';

@Injectable({ providedIn: 'root' })
export class InkLinesApi {
  private readonly http = inject(HttpClient);

  /** Hands in a trace; pixels are full-resolution scan pixels. */
  handIn(scanId: string, draft: InkLineDraft): Observable<InkLineSaved> {
    return this.http.post<InkLineSaved>(API.scanInkLines(scanId), draft);
  }
}
