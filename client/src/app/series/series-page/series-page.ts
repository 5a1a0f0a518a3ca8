import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import type { SeriesResponse } from '@shared/api/series';
import { catchError, map, of } from 'rxjs';

import { StationsApi } from '../../core/api/stations-api';
import { ApiError } from '../../core/http/api-error';
import { saveBlob } from '../../shared/object-url/object-url';
import { PressurePlot } from '../../shared/pressure-plot/pressure-plot';
import { SeriesApi } from '../series-api';
import { parseUtcDay, rangeInstantsMs, seriesCsvFileName, type SeriesRange } from '../series-range';

function utcDayValidator(control: AbstractControl<string>): ValidationErrors | null {
  return control.value === '' || parseUtcDay(control.value) !== null ? null : { utcDay: true };
}

function orderedDaysValidator(group: AbstractControl): ValidationErrors | null {
  const fromMs = parseUtcDay(group.get('fromDay')?.value ?? '');
  const toMs = parseUtcDay(group.get('toDay')?.value ?? '');
  return fromMs !== null && toMs !== null && toMs < fromMs ? { daysReversed: true } : null;
}

/** The station series of one station over chosen UTC days: plot with its uncertainty band, point and ink-line counts, CSV download. */
@Component({
  selector: 'isl-series-page',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule, MatProgressBarModule, PressurePlot],
  templateUrl: './series-page.html',
  styleUrl: './series-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SeriesPage {
  private readonly seriesApi = inject(SeriesApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly document = inject(DOCUMENT);

  protected readonly stations = toSignal(inject(StationsApi).listForSelect().pipe(map((page) => page.items), catchError(() => of([]))), { initialValue: [] });
  protected readonly form = inject(NonNullableFormBuilder).group(
    {
      stationId: ['', Validators.required],
      fromDay: ['', [Validators.required, utcDayValidator]],
      toDay: ['', [Validators.required, utcDayValidator]],
    },
    { validators: orderedDaysValidator },
  );
  /** The range whose series is on screen. */
  private readonly shownRange = signal<SeriesRange | null>(null);
  protected readonly series = signal<SeriesResponse | null>(null);
  protected readonly isLoading = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly isDownloading = signal(false);
  protected readonly sourceCountText = computed(() => {
    const count = this.series()?.sourceCount ?? 0;
    return `merged from ${count} ink ${count === 1 ? 'line' : 'lines'}`;
  });
  protected readonly timeDomainMs = computed(() => {
    const range = this.shownRange();
    return range ? rangeInstantsMs(range) : undefined;
  });

  protected showSeries(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const range = this.form.getRawValue();
    this.isLoading.set(true);
    this.failure.set(null);
    this.seriesApi
      .get(range)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (series) => {
          this.isLoading.set(false);
          this.shownRange.set(range);
          this.series.set(series);
        },
        error: (error: unknown) => {
          this.isLoading.set(false);
          this.failure.set(error instanceof ApiError ? error.message : 'The series could not be loaded.');
        },
      });
  }

  protected downloadCsv(): void {
    const range = this.shownRange();
    if (range === null) return;
    const code = this.stations().find((station) => station.id === range.stationId)?.code ?? range.stationId;
    this.isDownloading.set(true);
    this.seriesApi
      .getCsv(range)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (blob) => {
          this.isDownloading.set(false);
          saveBlob(blob, seriesCsvFileName(code, range.fromDay, range.toDay), this.document);
        },
        error: (error: unknown) => {
          this.isDownloading.set(false);
          this.failure.set(error instanceof ApiError ? error.message : 'The CSV could not be downloaded.');
        },
      });
  }
}
