import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type {
  LessonCreate,
  LessonDetail,
  LessonPassage,
  LessonScope,
  LessonSortKey,
  LessonSummary,
  SharedLesson,
  ShareLink,
} from '@shared/api/lessons';
import type { Page, PageQuery } from '@shared/api/paging';
import { API } from '@shared/api/routes';

import { toPageParams } from '../core/api/page-params';

/** The body of a lesson change: the version read and the fields to replace (notes and questions go whole). */
export type LessonChange = { version: number } & Partial<{
  title: string;
  audience: string;
  description: string;
  from: string;
  to: string;
  notes: unknown[];
  questions: unknown[];
  candidateDecisions: Record<string, 'accepted' | 'dismissed'>;
}>;

/** Lessons, their passages, share links and exports; the shared page's one read needs no sign-in. */
@Injectable({ providedIn: 'root' })
export class LessonsApi {
  private readonly http = inject(HttpClient);

  list(scope: LessonScope, query: PageQuery<LessonSortKey>): Observable<Page<LessonSummary>> {
    return this.http.get<Page<LessonSummary>>(API.lessons, { params: toPageParams(query, { scope }) });
  }

  create(input: LessonCreate): Observable<LessonDetail> {
    return this.http.post<LessonDetail>(API.lessons, input);
  }

  get(lessonId: string): Observable<LessonDetail> {
    return this.http.get<LessonDetail>(API.lesson(lessonId));
  }

  /** A stale `version` answers 409 version_conflict. */
  update(lessonId: string, change: LessonChange): Observable<LessonDetail> {
    return this.http.patch<LessonDetail>(API.lesson(lessonId), change);
  }

  remove(lessonId: string, version: number): Observable<void> {
    return this.http.delete<void>(API.lesson(lessonId), { params: { version } });
  }

  copy(lessonId: string): Observable<LessonDetail> {
    return this.http.post<LessonDetail>(API.lessonCopy(lessonId), {});
  }

  passage(lessonId: string): Observable<LessonPassage> {
    return this.http.get<LessonPassage>(API.lessonPassage(lessonId));
  }

  /** A chart region's JPEG as a Blob (through HttpClient, so the teacher's token is sent). */
  regionImage(imagePath: string): Observable<Blob> {
    return this.http.get(imagePath, { responseType: 'blob' });
  }

  /** The notes as W3C Web Annotation JSON-LD. */
  annotations(lessonId: string): Observable<Blob> {
    return this.http.get(API.lessonAnnotations(lessonId), { responseType: 'blob' });
  }

  shares(lessonId: string, query: PageQuery): Observable<Page<ShareLink>> {
    return this.http.get<Page<ShareLink>>(API.lessonShares(lessonId), { params: toPageParams(query) });
  }

  createShare(lessonId: string, expiresAt: string | null): Observable<ShareLink> {
    return this.http.post<ShareLink>(API.lessonShares(lessonId), { expiresAt });
  }

  updateShare(lessonId: string, shareId: string, change: { expiresAt?: string | null; revoked?: true }): Observable<ShareLink> {
    return this.http.patch<ShareLink>(API.lessonShare(lessonId, shareId), change);
  }

  /** What a share link shows; no account needed. */
  shared(token: string): Observable<SharedLesson> {
    return this.http.get<SharedLesson>(API.sharedLesson(token));
  }
}

/** The page address of a share link, on this app's origin. */
export function shareLinkUrl(origin: string, token: string): string {
  return `${origin}/shared/${encodeURIComponent(token)}`;
}
