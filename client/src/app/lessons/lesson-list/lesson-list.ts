import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { LESSON_SORT_KEYS, type LessonScope, type LessonSortKey, type LessonSummary } from '@shared/api/lessons';

import { ApiError } from '../../core/http/api-error';
import { createPagedList } from '../../shared/paged-list/paged-list';
import { LessonsApi, shareLinkUrl } from '../lessons-api';
import { formatUtc } from '../lesson-text';

/** One server-paged list of lessons: the teacher's own, their shared ones with links, or other teachers' to copy. */
@Component({
  selector: 'isl-lesson-list',
  imports: [MatButtonModule, MatIconModule, MatPaginatorModule, MatProgressBarModule, RouterLink],
  templateUrl: './lesson-list.html',
  styleUrl: './lesson-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LessonList {
  private readonly lessonsApi = inject(LessonsApi);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);
  private readonly origin = inject(DOCUMENT).location.origin;

  readonly scope = input.required<LessonScope>();

  protected readonly list = createPagedList<LessonSummary, LessonSortKey>({
    initialQuery: { page: 0, pageSize: 10, direction: 'desc' },
    sortKeys: LESSON_SORT_KEYS,
    load: (query) => this.lessonsApi.list(this.scope(), query),
    failureMessage: 'The lessons could not be loaded.',
  });
  protected readonly copyFailure = signal<string | null>(null);
  protected readonly formatUtc = formatUtc;

  protected linkOf(token: string): string {
    return shareLinkUrl(this.origin, token);
  }

  protected copyLesson(lesson: LessonSummary): void {
    this.copyFailure.set(null);
    this.lessonsApi
      .copy(lesson.id)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (copy) => void this.router.navigate(['/lessons', copy.id]),
        error: (error: unknown) => this.copyFailure.set(error instanceof ApiError ? error.message : 'The lesson could not be copied.'),
      });
  }
}
