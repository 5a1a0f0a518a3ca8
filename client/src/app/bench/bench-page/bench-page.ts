import { DatePipe, KeyValuePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { type InkLineSaved, parseInkLineDraft } from '@shared/api/ink-lines';
import type { ScanDetail } from '@shared/api/scans';
import { catchError, map, of, switchMap } from 'rxjs';

import { ChartFormsApi } from '../../core/api/chart-forms-api';
import { ScansApi } from '../../core/api/scans-api';
import { ApiError } from '../../core/http/api-error';
import { ObjectUrlHolder } from '../../shared/object-url/object-url';
import { BenchState, type BenchStep } from '../bench-state';
import { HandInResult } from '../hand-in-result/hand-in-result';
import { InkLinesApi } from '../ink-lines-api';
import { InkStep } from '../ink-step/ink-step';
import { PinStep } from '../pin-step/pin-step';
import { ScanStage } from '../scan-stage/scan-stage';
import type { Size } from '../scan-stage/view-transform';

/** Longest side of the image the Bench shows, px: sharp enough to click on, light enough to pan. */
const BENCH_IMAGE_SIDE_PX = 2400;

interface HandInProblem {
  message: string;
  details: Record<string, string>;
}

/** The tracing editor for one scan: the scan stage, the Pin and Ink steps, and Hand in. */
@Component({
  selector: 'isl-bench-page',
  imports: [DatePipe, KeyValuePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, ScanStage, PinStep, InkStep, HandInResult],
  providers: [BenchState],
  templateUrl: './bench-page.html',
  styleUrl: './bench-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BenchPage {
  private readonly scansApi = inject(ScansApi);
  private readonly inkLinesApi = inject(InkLinesApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly previewUrls = new ObjectUrlHolder(this.destroyRef);
  protected readonly state = inject(BenchState);

  /** From the route parameter. */
  readonly scanId = input.required<string>();

  private readonly scanResult = toSignal(
    toObservable(this.scanId).pipe(
      switchMap((scanId) =>
        this.scansApi.get(scanId).pipe(
          map((scan): { scan: ScanDetail | null; failure: string | null } => ({ scan, failure: null })),
          catchError((error: unknown) => of({ scan: null, failure: error instanceof ApiError ? error.message : 'The scan could not be loaded.' })),
        ),
      ),
    ),
  );
  protected readonly scan = computed(() => this.scanResult()?.scan ?? null);
  protected readonly scanFailure = computed(() => this.scanResult()?.failure ?? null);
  protected readonly previewUrl = toSignal(
    toObservable(this.scanId).pipe(
      switchMap((scanId) =>
        // The Bench reads its image through IIIF like every viewer; the plain preview stands in while the worker has not made the tiles yet.
        this.scansApi.iiifImage(scanId, BENCH_IMAGE_SIDE_PX).pipe(
          catchError(() => this.scansApi.preview(scanId)),
          map((blob) => this.previewUrls.replace(blob)),
          catchError(() => of(null)),
        ),
      ),
    ),
  );
  private readonly chartForms = toSignal(inject(ChartFormsApi).listForSelect().pipe(map((page) => page.items), catchError(() => of([]))), { initialValue: [] });
  protected readonly chartForm = computed(() => this.chartForms().find((form) => form.id === this.scan()?.chartFormId) ?? null);

  protected readonly isHandingIn = signal(false);
  protected readonly saved = signal<InkLineSaved | null>(null);
  protected readonly problem = signal<HandInProblem | null>(null);

  protected chooseStep(step: BenchStep): void {
    this.state.chooseStep(step);
  }

  protected notePreviewSize(size: Size): void {
    const scan = this.scan();
    if (scan) this.state.setPreviewWidth(scan.widthPx, size.width);
  }

  protected pickPoint(point: { x: number; y: number }): void {
    if (this.state.scanPxPerPreviewPx() !== null) this.state.pickPoint(point);
  }

  protected moveKnot(move: { index: number; point: { x: number; y: number } }): void {
    if (this.state.scanPxPerPreviewPx() !== null) this.state.moveKnot(move.index, move.point);
  }

  protected deleteKnot(index: number): void {
    this.state.deleteKnot(index);
  }

  protected handIn(): void {
    const parsed = parseInkLineDraft(this.state.draft());
    this.saved.set(null);
    if (!parsed.ok) {
      this.problem.set({ message: 'Not ready to hand in yet:', details: parsed.details });
      return;
    }
    this.problem.set(null);
    this.isHandingIn.set(true);
    this.inkLinesApi
      .handIn(this.scanId(), parsed.value)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (saved) => {
          this.isHandingIn.set(false);
          this.saved.set(saved);
        },
        error: (error: unknown) => {
          this.isHandingIn.set(false);
          this.problem.set(
            error instanceof ApiError ? { message: error.message, details: error.details } : { message: 'The hand-in failed.', details: {} },
          );
        },
      });
  }
}
