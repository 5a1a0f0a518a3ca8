import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { ScanSummary } from '@shared/api/scans';
import { catchError, map, of, startWith, switchMap } from 'rxjs';

import { ChartFormsApi } from '../../core/api/chart-forms-api';
import { ScansApi } from '../../core/api/scans-api';
import { StationsApi } from '../../core/api/stations-api';
import { problemText } from '../../core/http/problem-text';
import { SavedNotice } from '../../shared/saved-notice/saved-notice';
import { loadSelectOptions } from '../../shared/select-options/select-options';
import { SelectOptionsFailure } from '../../shared/select-options/select-options-failure';
import { type BulkEditChoices, planBulkEdit } from './bulk-edit-plan';

/**
 * Sets station, instrument, chart form, box and tags on the selected scans at once, and chart starts read from
 * their file names by a pattern, previewed scan by scan before anything is sent.
 */
@Component({
  selector: 'isl-bulk-edit-panel',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, SelectOptionsFailure],
  templateUrl: './bulk-edit-panel.html',
  styleUrl: './bulk-edit-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BulkEditPanel {
  private readonly scansApi = inject(ScansApi);
  private readonly stationsApi = inject(StationsApi);
  private readonly savedNotice = inject(SavedNotice);
  private readonly destroyRef = inject(DestroyRef);

  /** The scans chosen in the catalogue. */
  readonly scans = input.required<readonly ScanSummary[]>();
  /** How many scans the edit changed, once the server has stored it. */
  readonly applied = output<number>();
  readonly closed = output<void>();

  protected readonly stationOptions = loadSelectOptions(this.stationsApi.listForSelect(), 'The stations');
  protected readonly chartFormOptions = loadSelectOptions(inject(ChartFormsApi).listForSelect(), 'The chart forms');
  protected readonly form = inject(NonNullableFormBuilder).group<BulkEditChoices>({
    stationId: '',
    instrumentId: '',
    chartFormId: '',
    box: '',
    addTags: '',
    fileNamePattern: '',
  });
  private readonly choices = toSignal(this.form.valueChanges.pipe(map(() => this.form.getRawValue())), { initialValue: this.form.getRawValue() });
  /** The chosen station's instruments; none until a station is chosen. */
  protected readonly instruments = toSignal(
    toObservable(computed(() => this.choices().stationId)).pipe(
      switchMap((stationId) => (stationId === '' ? of([]) : this.stationsApi.instruments(stationId).pipe(map((page) => page.items), catchError(() => of([]))))),
      startWith([]),
    ),
    { initialValue: [] },
  );
  protected readonly plan = computed(() => planBulkEdit(this.scans(), this.choices()));
  protected readonly matchedCount = computed(() => this.plan().preview.filter((row) => row.chartStart !== null).length);
  protected readonly isSending = signal(false);
  protected readonly failure = signal<string | null>(null);

  constructor() {
    // An instrument belongs to its station: a new station clears the instrument chosen for the old one.
    this.form.controls.stationId.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.form.controls.instrumentId.setValue(''));
  }

  protected apply(): void {
    const plan = this.plan();
    if (plan.kind !== 'ready') return;
    this.isSending.set(true);
    this.failure.set(null);
    this.scansApi
      .bulkEdit(plan.input)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (result) => {
          this.isSending.set(false);
          this.savedNotice.show(`${result.items.length} ${result.items.length === 1 ? 'scan' : 'scans'} changed.`);
          this.applied.emit(result.items.length);
        },
        error: (error: unknown) => {
          this.isSending.set(false);
          this.failure.set(problemText(error, 'The scans could not be changed. Nothing was saved.'));
        },
      });
  }
}
