import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { InstrumentSummary } from '@shared/api/instruments';
import type { ScanDetail } from '@shared/api/scans';
import { catchError, distinctUntilChanged, map, of, startWith, switchMap } from 'rxjs';

import { ChartFormsApi } from '../../core/api/chart-forms-api';
import { ScansApi } from '../../core/api/scans-api';
import { StationsApi } from '../../core/api/stations-api';
import { ApiError } from '../../core/http/api-error';
import { normalizeInstant } from '@shared/api/parse-instant';
import { scanMetadataChanges, valuesOfScan } from './scan-metadata-changes';
import { loadSelectOptions } from '../../shared/select-options/select-options';
import { SelectOptionsFailure } from '../../shared/select-options/select-options-failure';
import { SavedNotice } from '../../shared/saved-notice/saved-notice';

function utcInstantValidator(control: AbstractControl<string>): ValidationErrors | null {
  return control.value.trim() === '' || normalizeInstant(control.value) !== null ? null : { utcInstant: true };
}

function dpiValidator(control: AbstractControl<string>): ValidationErrors | null {
  if (control.value.trim() === '') return null;
  const dpi = Number(control.value);
  return Number.isFinite(dpi) && dpi > 0 && dpi <= 10000 ? null : { dpi: true };
}

type Problem = { kind: 'conflict'; message: string } | { kind: 'invalid'; message: string; details: Record<string, string> };

/**
 * The scan's catalogue fields. Saves only what changed, with the version it read; when someone else saved
 * first the server answers 409 and the form offers to reload their version.
 */
@Component({
  selector: 'isl-scan-metadata-form',
  imports: [SelectOptionsFailure, ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule],
  templateUrl: './scan-metadata-form.html',
  styleUrl: './scan-metadata-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ScanMetadataForm {
  private readonly scansApi = inject(ScansApi);
  private readonly savedNotice = inject(SavedNotice);
  private readonly stationsApi = inject(StationsApi);
  private readonly destroyRef = inject(DestroyRef);

  readonly scan = input.required<ScanDetail>();
  readonly saved = output<ScanDetail>();
  readonly reloadRequested = output<void>();

  protected readonly stationOptions = loadSelectOptions(this.stationsApi.listForSelect(), 'The stations');
  protected readonly stations = this.stationOptions.items;
  protected readonly chartFormOptions = loadSelectOptions(inject(ChartFormsApi).listForSelect(), 'The chart forms');
  protected readonly chartForms = this.chartFormOptions.items;
  protected readonly form = inject(NonNullableFormBuilder).group({
    stationId: [''],
    instrumentId: [''],
    chartFormId: [''],
    chartStart: ['', utcInstantValidator],
    chartOn: ['', utcInstantValidator],
    chartOff: ['', utcInstantValidator],
    observer: [''],
    collection: [''],
    box: [''],
    folder: [''],
    item: [''],
    dpi: ['', dpiValidator],
    tags: [''],
    conditionNotes: [''],
    notes: [''],
    transcription: [''],
  });
  protected readonly instruments = toSignal(
    this.form.controls.stationId.valueChanges.pipe(
      startWith(this.form.controls.stationId.value),
      distinctUntilChanged(),
      switchMap((stationId) =>
        stationId ? this.stationsApi.instruments(stationId).pipe(map((page) => page.items), catchError(() => of<InstrumentSummary[]>([]))) : of<InstrumentSummary[]>([]),
      ),
    ),
    { initialValue: [] as InstrumentSummary[] },
  );
  protected readonly isSaving = signal(false);
  protected readonly problem = signal<Problem | null>(null);
  protected readonly savedVersion = signal<number | null>(null);
  private readonly scanVersion = computed(() => `${this.scan().id}@${this.scan().version}`);

  constructor() {
    // A newer version of the scan (a reload, a status change) resets the form to what the server holds.
    toObservable(this.scanVersion)
      .pipe(distinctUntilChanged(), takeUntilDestroyed())
      .subscribe(() => {
        this.form.reset(valuesOfScan(this.scan()));
        this.problem.set(null);
      });
    effect(() => {
      if (this.isSaving()) this.form.disable({ emitEvent: false });
      else this.form.enable({ emitEvent: false });
    });
  }

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const scan = this.scan();
    const changes = scanMetadataChanges(scan, this.form.getRawValue());
    if (Object.keys(changes).length === 1) return;
    // A station change leaves the old station's instrument behind.
    if (changes.stationId !== undefined && changes.instrumentId === undefined && scan.instrumentId) changes.instrumentId = null;
    this.isSaving.set(true);
    this.problem.set(null);
    this.scansApi
      .update(scan.id, changes)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (updated) => {
          this.isSaving.set(false);
          this.savedVersion.set(updated.version);
          this.savedNotice.show('Catalogue fields saved.');
          this.saved.emit(updated);
        },
        error: (error: unknown) => {
          this.isSaving.set(false);
          this.problem.set(problemOf(error));
        },
      });
  }

  protected revert(): void {
    this.form.reset(valuesOfScan(this.scan()));
    this.problem.set(null);
  }

  protected detailFor(field: string): string | null {
    const problem = this.problem();
    return problem?.kind === 'invalid' ? (problem.details[field] ?? null) : null;
  }
}

function problemOf(error: unknown): Problem {
  if (error instanceof ApiError && error.code === 'version_conflict') {
    return { kind: 'conflict', message: 'Someone else changed this scan after you opened it. Reload to see their version, then make your change again.' };
  }
  if (error instanceof ApiError) return { kind: 'invalid', message: error.message, details: error.details };
  return { kind: 'invalid', message: 'The changes could not be saved.', details: {} };
}
