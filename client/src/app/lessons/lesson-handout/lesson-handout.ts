import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, input, signal, ViewEncapsulation } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { LESSON_CAUTION, type LessonDetail, type LessonPassage, lessonSourceLine, regionOfMark } from '@shared/api/lessons';
import { forkJoin, switchMap, tap } from 'rxjs';

import { ApiError } from '../../core/http/api-error';
import { LessonsApi } from '../lessons-api';
import { LessonView, type LessonViewModel } from '../lesson-view/lesson-view';
import { RegionImages } from '../region-images/region-images';

/** The teacher's lesson as the handout shows it: marks placed on the region they fall in, the same caution line. */
export function teacherViewModel(lesson: LessonDetail, passage: LessonPassage): LessonViewModel {
  return {
    title: lesson.title,
    audience: lesson.audience,
    description: lesson.description,
    stationName: lesson.stationName,
    from: lesson.from,
    to: lesson.to,
    notes: lesson.notes.map((note) => {
      const region = note.mark ? regionOfMark(passage.regions, note.mark) : undefined;
      const { scanId: _scanId, ...mark } = note.mark ?? { scanId: '' };
      return { ...note, mark: note.mark && region ? { ...(mark as Omit<NonNullable<typeof note.mark>, 'scanId'>), regionIndex: region.index } : null };
    }),
    questions: lesson.questions,
    points: passage.points,
    regions: passage.regions,
    caution: LESSON_CAUTION,
    source: lessonSourceLine(lesson.stationName, lesson.stationCode, lesson.ownerName),
  };
}

/**
 * The handout of a lesson, for the teacher to check and print. While it is shown, printing leaves out the
 * app's toolbar and navigation (hence no view encapsulation for the print rules, which name the shell).
 */
@Component({
  selector: 'isl-lesson-handout',
  imports: [MatButtonModule, MatIconModule, RouterLink, LessonView],
  template: `
    <section class="isl-page isl-handout-page">
      <div class="isl-handout-actions isl-form-row">
        <a mat-button [routerLink]="['/lessons', lessonId()]">
          <mat-icon>arrow_back</mat-icon>
          Back to the lesson
        </a>
        <button mat-flat-button type="button" (click)="print()" data-testid="handout-print">
          <mat-icon>print</mat-icon>
          Print
        </button>
      </div>
      @if (failure(); as failure) {
        <p class="isl-inline-error" role="alert">{{ failure }}</p>
      }
      @if (view(); as view) {
        <isl-lesson-view [lesson]="view" [imageUrls]="imageUrls()" />
      }
    </section>
  `,
  styles: `
    .isl-handout-actions { justify-content: space-between; max-width: 980px; margin: 0 auto 8px; }
    @media print {
      isl-app-shell .mat-toolbar, isl-app-shell .mat-sidenav, .isl-handout-actions { display: none !important; }
      isl-app-shell .mat-sidenav-content { margin: 0 !important; }
      isl-app-shell .mat-sidenav-container, isl-app-shell .mat-sidenav-content { overflow: visible !important; height: auto !important; position: static !important; }
      .isl-handout-page { padding: 0 !important; }
    }
  `,
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LessonHandout {
  private readonly lessonsApi = inject(LessonsApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly regionImages = new RegionImages(inject(DestroyRef));

  readonly lessonId = input.required<string>();

  private readonly loaded = signal<{ lesson: LessonDetail; passage: LessonPassage } | null>(null);
  protected readonly imageUrls = signal<Record<number, string>>({});
  protected readonly failure = signal<string | null>(null);
  protected readonly view = computed(() => {
    const loaded = this.loaded();
    return loaded ? teacherViewModel(loaded.lesson, loaded.passage) : null;
  });

  constructor() {
    effect(() => this.load(this.lessonId()));
  }

  protected print(): void {
    window.print();
  }

  private load(lessonId: string): void {
    forkJoin({ lesson: this.lessonsApi.get(lessonId), passage: this.lessonsApi.passage(lessonId) })
      .pipe(
        tap((loaded) => this.loaded.set(loaded)),
        switchMap(({ passage }) => this.regionImages.load(passage.regions, (path) => this.lessonsApi.regionImage(path))),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (urls) => this.imageUrls.set(urls),
        error: (error: unknown) => this.failure.set(error instanceof ApiError ? error.message : 'The handout could not be loaded.'),
      });
  }
}
