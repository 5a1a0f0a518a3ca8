import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink } from '@angular/router';
import type { ChartFormSummary } from '@shared/api/chart-forms';
import { IIIF } from '@shared/api/routes';
import type { ScanDetail } from '@shared/api/scans';
import { catchError, combineLatest, distinctUntilChanged, EMPTY, map, of, switchMap, timer } from 'rxjs';

import { ChartFormsApi } from '../../core/api/chart-forms-api';
import { ScansApi } from '../../core/api/scans-api';
import { ApiError } from '../../core/http/api-error';
import { ScanStatusChip } from '../../shared/scan-status-chip/scan-status-chip';
import { CloseView } from '../close-view/close-view';
import { ScanChangeLog } from '../scan-change-log/scan-change-log';
import { ScanMetadataForm } from '../scan-metadata-form/scan-metadata-form';
import { TracingSettings } from '../tracing-settings/tracing-settings';
import { ScanStatusActions } from '../scan-status-actions/scan-status-actions';

/** While the worker makes the derivatives, look again this often. */
const DERIVATIVE_POLL_MS = 2500;

interface ScanView {
  scan: ScanDetail | null;
  failure: string | null;
}

/**
 * One scan: the close view on the left (the scan is the hero), and beside it the catalogue fields, the status
 * actions and the change log. The chart form's grid can be laid over the scan to check the form.
 */
@Component({
  selector: 'isl-scan-page',
  imports: [
    DatePipe,
    DecimalPipe,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatSlideToggleModule,
    MatTabsModule,
    ScanStatusChip,
    CloseView,
    ScanChangeLog,
    ScanMetadataForm,
    ScanStatusActions,
    TracingSettings,
  ],
  templateUrl: './scan-page.html',
  styleUrl: './scan-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ScanPage {
  private readonly scansApi = inject(ScansApi);
  private readonly chartFormsApi = inject(ChartFormsApi);
  private readonly destroyRef = inject(DestroyRef);

  /** From the route parameter. */
  readonly scanId = input.required<string>();

  private readonly reloads = signal(0);
  /** The latest scan a save or status change answered with; newer than the last load. */
  private readonly answered = signal<ScanDetail | null>(null);
  private readonly loaded = toSignal(
    combineLatest([toObservable(this.scanId), toObservable(this.reloads)]).pipe(
      switchMap(([scanId]) =>
        this.scansApi.get(scanId).pipe(
          map((scan): ScanView => ({ scan, failure: null })),
          catchError((error: unknown) => of<ScanView>({ scan: null, failure: error instanceof ApiError ? error.message : 'The scan could not be loaded.' })),
        ),
      ),
    ),
  );
  protected readonly scan = computed(() => {
    const answered = this.answered();
    const loaded = this.loaded()?.scan ?? null;
    if (answered && loaded && answered.id === loaded.id && answered.version >= loaded.version) return answered;
    return loaded;
  });
  protected readonly failure = computed(() => this.loaded()?.failure ?? null);
  protected readonly changeLogRefresh = signal(0);
  protected readonly showGrid = signal(false);
  protected readonly isRetrying = signal(false);
  protected readonly retryFailure = signal<string | null>(null);

  private readonly chartFormId = computed(() => this.scan()?.chartFormId ?? null);
  protected readonly chartForm = toSignal(
    toObservable(this.chartFormId).pipe(
      distinctUntilChanged(),
      switchMap((id) => (id ? this.chartFormsApi.get(id).pipe(catchError(() => of(null))) : of(null))),
    ),
    { initialValue: null as ChartFormSummary | null },
  );
  /** The archive's own address, so the manifest URL can be copied into another IIIF viewer. */
  protected readonly iiifBase = signal(typeof location === 'undefined' ? '' : location.origin);
  protected readonly manifestPath = IIIF.manifest;
  protected readonly pageLabel = computed(() => {
    const scan = this.scan();
    return scan && scan.pageCount > 1 ? `page ${scan.pageIndex + 1} of ${scan.pageCount}` : null;
  });

  constructor() {
    // Poll while the worker is busy, so the viewer opens as soon as the tiles exist.
    toObservable(computed(() => this.scan()?.derivativeState ?? null))
      .pipe(
        distinctUntilChanged(),
        switchMap((state) => (state === 'queued' || state === 'working' ? timer(DERIVATIVE_POLL_MS, DERIVATIVE_POLL_MS) : EMPTY)),
        takeUntilDestroyed(),
      )
      .subscribe(() => this.reload());
  }

  protected reload(): void {
    this.answered.set(null);
    this.reloads.update((n) => n + 1);
  }

  protected takeAnswer(scan: ScanDetail): void {
    this.answered.set(scan);
    this.changeLogRefresh.update((n) => n + 1);
  }

  protected retryDerivatives(): void {
    this.isRetrying.set(true);
    this.retryFailure.set(null);
    this.scansApi
      .retryDerivatives(this.scanId())
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (scan) => {
          this.isRetrying.set(false);
          this.takeAnswer(scan);
        },
        error: (error: unknown) => {
          this.isRetrying.set(false);
          this.retryFailure.set(error instanceof ApiError ? error.message : 'The retry could not be queued.');
        },
      });
  }
}
