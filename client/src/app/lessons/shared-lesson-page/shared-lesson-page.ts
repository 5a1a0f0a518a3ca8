import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Meta, Title } from '@angular/platform-browser';
import type { SharedLesson } from '@shared/api/lessons';

import { ApiError } from '../../core/http/api-error';
import { LessonsApi } from '../lessons-api';
import { LessonView, type LessonViewModel } from '../lesson-view/lesson-view';

/** The share link's view as the handout component takes it; region images come from the link's own path. */
export function sharedToViewModel(shared: SharedLesson): LessonViewModel {
  return { ...shared, points: shared.passage.points, regions: shared.passage.regions };
}

/** The public page of a share link: one lesson, read-only, for a class without accounts; kept out of search engines. */
@Component({
  selector: 'isl-shared-lesson-page',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, LessonView],
  template: `
    <main class="page">
      @if (isLoading()) {
        <mat-progress-bar mode="indeterminate" />
      }
      @if (failure(); as failure) {
        <p class="failure" role="alert" data-testid="shared-lesson-failure">{{ failure }}</p>
      }
      @if (view(); as view) {
        <div class="actions">
          <button mat-stroked-button type="button" (click)="print()" data-testid="shared-lesson-print">
            <mat-icon>print</mat-icon>
            Print the handout
          </button>
        </div>
        <isl-lesson-view [lesson]="view" [imageUrls]="imageUrls()" />
      }
    </main>
  `,
  styles: `
    .page { padding: 12px 16px 32px; box-sizing: border-box; }
    .actions { display: flex; justify-content: flex-end; max-width: 980px; margin: 0 auto 4px; }
    .failure { font: var(--mat-sys-body-large); color: var(--mat-sys-error); max-width: 980px; margin: 24px auto; }
    @media print { .actions { display: none; } .page { padding: 0; } }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SharedLessonPage {
  private readonly lessonsApi = inject(LessonsApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly title = inject(Title);

  /** From the route (withComponentInputBinding). */
  readonly token = input.required<string>();

  private readonly shared = signal<SharedLesson | null>(null);
  protected readonly isLoading = signal(true);
  protected readonly failure = signal<string | null>(null);
  protected readonly view = computed(() => {
    const shared = this.shared();
    return shared ? sharedToViewModel(shared) : null;
  });
  protected readonly imageUrls = computed(() => Object.fromEntries((this.shared()?.passage.regions ?? []).map((region) => [region.index, region.imagePath])));

  constructor() {
    // The header says so too (X-Robots-Tag); the tag covers a page saved or served another way.
    const meta = inject(Meta);
    meta.updateTag({ name: 'robots', content: 'noindex, nofollow' });
    this.destroyRef.onDestroy(() => meta.removeTag('name="robots"'));
    effect(() => this.load(this.token()));
  }

  protected print(): void {
    window.print();
  }

  private load(token: string): void {
    this.lessonsApi
      .shared(token)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (shared) => {
          this.isLoading.set(false);
          this.shared.set(shared);
          this.title.setTitle(`${shared.title} · Isallo`);
        },
        error: (error: unknown) => {
          this.isLoading.set(false);
          this.failure.set(error instanceof ApiError && error.status === 404 ? 'This link does not work any more: it has expired or was withdrawn by the teacher.' : 'The lesson could not be loaded.');
        },
      });
  }
}
