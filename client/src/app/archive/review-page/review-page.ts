import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import type { ReviewDetail, ReviewedLine } from '@shared/api/review';
import type { SeriesPoint } from '@shared/api/series';
import { catchError, map, of, switchMap } from 'rxjs';

import { ScansApi } from '../../core/api/scans-api';
import { ApiError } from '../../core/http/api-error';
import { ObjectUrlHolder } from '../../shared/object-url/object-url';
import { PressurePlot } from '../../shared/pressure-plot/pressure-plot';
import { LineDifferencePlot } from '../line-difference/line-difference-plot';
import { ReviewCorrections } from '../review-corrections/review-corrections';
import { ReviewOverlay } from '../review-overlay/review-overlay';
import { ReviewApi } from '../review-api';

const IMAGE_SIDE_PX = 2400;

/** The line's hourly points as the plot draws a series. */
function asSeries(line: ReviewedLine): SeriesPoint[] {
  return line.points.map((point) => ({ ...point, inkLineId: line.inkLineId }));
}

/**
 * One ink line under review: the scan with the ghost grid, the line and its pins drawn over it, the corrected
 * hourly series with its flags, the pin residuals against the chart form's limit, the clock and instrument
 * corrections with their residuals, the cross-trace with the difference of the two lines,
 * the review history, and Approve or Return with a note.
 */
@Component({
  selector: 'isl-review-page',
  imports: [DatePipe, DecimalPipe, FormsModule, RouterLink, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, PressurePlot, LineDifferencePlot, ReviewOverlay, ReviewCorrections],
  templateUrl: './review-page.html',
  styleUrl: './review-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewPage {
  private readonly reviewApi = inject(ReviewApi);
  private readonly scansApi = inject(ScansApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly imageUrls = new ObjectUrlHolder(this.destroyRef);

  /** From the route parameter. */
  readonly inkLineId = input.required<string>();

  private readonly reloads = signal(0);
  private readonly detailResult = toSignal(
    toObservable(computed(() => ({ id: this.inkLineId(), reload: this.reloads() }))).pipe(
      switchMap(({ id }) =>
        this.reviewApi.detail(id).pipe(
          map((detail): { detail: ReviewDetail | null; failure: string | null } => ({ detail, failure: null })),
          catchError((error: unknown) => of({ detail: null, failure: error instanceof ApiError ? error.message : 'The ink line could not be loaded.' })),
        ),
      ),
    ),
  );
  protected readonly detail = computed(() => this.detailResult()?.detail ?? null);
  protected readonly failure = computed(() => this.detailResult()?.failure ?? null);
  protected readonly imageUrl = toSignal(
    toObservable(computed(() => this.detail()?.scan.id ?? null)).pipe(
      switchMap((scanId) =>
        scanId === null
          ? of(null)
          : this.scansApi.iiifImage(scanId, IMAGE_SIDE_PX).pipe(
              catchError(() => this.scansApi.preview(scanId)),
              map((blob) => this.imageUrls.replace(blob)),
              catchError(() => of(null)),
            ),
      ),
    ),
  );
  protected readonly lineSeries = computed(() => {
    const detail = this.detail();
    return detail ? asSeries(detail.line) : [];
  });
  protected readonly crossSeries = computed(() => {
    const cross = this.detail()?.crossTrace;
    return cross ? asSeries(cross) : [];
  });
  protected readonly flagCounts = computed(() => {
    const counts: Record<string, number> = {};
    for (const point of this.detail()?.line.points ?? []) counts[point.flag] = (counts[point.flag] ?? 0) + 1;
    return Object.entries(counts).map(([flag, count]) => `${flag.replace(/_/g, ' ')} ${count}`).join(' · ');
  });

  protected readonly showsGrid = signal(true);
  protected readonly note = signal('');
  protected readonly isBusy = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly done = signal<string | null>(null);

  protected approve(detail: ReviewDetail): void {
    this.decide(this.reviewApi.approve(detail.row.inkLineId, detail.row.version), 'Approved: the line is now part of the station series.');
  }

  protected giveBack(detail: ReviewDetail): void {
    this.decide(this.reviewApi.giveBack(detail.row.inkLineId, detail.row.version, this.note().trim()), 'Returned to the volunteer with your note.');
  }

  private decide(call: ReturnType<ReviewApi['approve']>, doneText: string): void {
    this.isBusy.set(true);
    this.problem.set(null);
    call.pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: () => {
        this.isBusy.set(false);
        this.done.set(doneText);
        this.note.set('');
        this.reloads.update((n) => n + 1);
      },
      error: (error: unknown) => {
        this.isBusy.set(false);
        const isConflict = error instanceof ApiError && error.code === 'version_conflict';
        this.problem.set(
          isConflict ? 'Another archivist decided on this line meanwhile; the page now shows their decision.' : error instanceof ApiError ? error.message : 'The decision was not saved.',
        );
        if (isConflict) this.reloads.update((n) => n + 1);
      },
    });
  }
}
