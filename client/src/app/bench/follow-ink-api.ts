import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import { followInkPath, type FollowInkRequest, type FollowInkResult } from '@shared/api/follow-ink';

@Injectable({ providedIn: 'root' })
export class FollowInkApi {
  private readonly http = inject(HttpClient);

  /** Lets Follow ink find the pen line; pins and the answer's knots are full-resolution scan pixels. */
  follow(scanId: string, request: FollowInkRequest): Observable<FollowInkResult> {
    return this.http.post<FollowInkResult>(followInkPath(scanId), request);
  }
}
