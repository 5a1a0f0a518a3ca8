import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { FollowInkRequest, FollowInkResult } from '@shared/api/follow-ink';
import { API } from '@shared/api/routes';

@Injectable({ providedIn: 'root' })
export class FollowInkApi {
  private readonly http = inject(HttpClient);

  /** Lets Follow ink find the pen line; pins and the answer's knots are full-resolution scan pixels. */
  follow(scanId: string, request: FollowInkRequest): Observable<FollowInkResult> {
    return this.http.post<FollowInkResult>(API.scanFollowInk(scanId), request);
  }
}
