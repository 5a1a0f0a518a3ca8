import { KeyValuePipe } from '@angular/common';
import { HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, output, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import type { ScanDetail } from '@shared/api/scans';

import { ChartFormsApi } from '../../core/api/chart-forms-api';
import { ScansApi } from '../../core/api/scans-api';
import { StationsApi } from '../../core/api/stations-api';
import { normalizeInstant } from '@shared/api/parse-instant';
import { outcomeOfFailure, type UploadOutcome } from './upload-outcome';
import { loadSelectOptions } from '../../shared/select-options/select-options';
import { SelectOptionsFailure } from '../../shared/select-options/select-options-failure';

function utcInstantValidator(control: AbstractControl<string>): ValidationErrors | null {
  return control.value === '' || normalizeInstant(control.value) !== null ? null : { utcInstant: true };
}

/** One scan at a time: the file, its station, chart form and chart-on time, with upload progress. */
@Component({
  selector: 'isl-upload-panel',
  imports: [SelectOptionsFailure, ReactiveFormsModule, RouterLink, KeyValuePipe, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './upload-panel.html',
  styleUrl: './upload-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadPanel {
  private readonly scansApi = inject(ScansApi);
  private readonly destroyRef = inject(DestroyRef);

  /** Emits the scan the server stored, so the catalogue can refresh. */
  readonly stored = output<ScanDetail>();

  protected readonly stationOptions = loadSelectOptions(inject(StationsApi).listForSelect(), 'The stations');
  protected readonly stations = this.stationOptions.items;
  protected readonly chartFormOptions = loadSelectOptions(inject(ChartFormsApi).listForSelect(), 'The chart forms');
  protected readonly chartForms = this.chartFormOptions.items;
  protected readonly form = inject(NonNullableFormBuilder).group({
    stationId: ['', Validators.required],
    chartFormId: ['', Validators.required],
    chartStart: ['', [Validators.required, utcInstantValidator]],
  });
  protected readonly file = signal<File | null>(null);
  protected readonly progressPercent = signal<number | null>(null);
  protected readonly outcome = signal<UploadOutcome | null>(null);
  protected readonly isUploading = computed(() => this.progressPercent() !== null);
  protected readonly isFileMissing = signal(false);

  protected pickFile(event: Event): void {
    const input = event.target as HTMLInputElement;
    this.file.set(input.files?.item(0) ?? null);
    this.isFileMissing.set(false);
  }

  protected uploadScan(): void {
    const file = this.file();
    const chartStart = normalizeInstant(this.form.controls.chartStart.value);
    if (this.form.invalid || file === null || chartStart === null) {
      this.form.markAllAsTouched();
      this.isFileMissing.set(file === null);
      return;
    }
    this.outcome.set(null);
    this.progressPercent.set(0);
    const { stationId, chartFormId } = this.form.getRawValue();
    this.scansApi
      .upload(file, { stationId, chartFormId, chartStart })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (event) => {
          if (event.type === HttpEventType.UploadProgress) {
            this.progressPercent.set(event.total ? Math.round((100 * event.loaded) / event.total) : 0);
          } else if (event.type === HttpEventType.Response && event.body) {
            this.progressPercent.set(null);
            this.outcome.set({ kind: 'stored', scan: event.body });
            this.stored.emit(event.body);
          }
        },
        error: (error: unknown) => {
          this.progressPercent.set(null);
          this.outcome.set(outcomeOfFailure(error));
        },
      });
  }
}
