import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import type { IntakeFileFields } from '@shared/api/intake';
import { map, of, switchMap } from 'rxjs';

import { ChartFormsApi } from '../../core/api/chart-forms-api';
import { StationsApi } from '../../core/api/stations-api';
import { ApiError } from '../../core/http/api-error';
import { BatchSummary } from '../batch-summary/batch-summary';
import { filesFromDrop, sortSelection } from '../dropped-files';
import { IntakeApi } from '../intake-api';
import { IntakeQueue } from '../intake-queue';
import type { SendsFiles } from '../intake-running-guard';
import { IntakeProgress } from '../intake-progress/intake-progress';
import { RecentBatches } from '../recent-batches/recent-batches';
import { UploadPanel } from '../upload-panel/upload-panel';
import { loadSelectOptions } from '../../shared/select-options/select-options';
import { SelectOptionsFailure } from '../../shared/select-options/select-options-failure';

const ACCEPTED = 'image/tiff,image/jpeg,image/png,application/pdf,.tif,.tiff,.jpg,.jpeg,.png,.pdf,.csv,text/csv';

function defaultLabel(now: Date): string {
  return `Intake ${now.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

/**
 * Intake: an archivist drops a box's files (or picks them, or a folder), names the batch, optionally sets a
 * station and chart form for all of them, and sends them a few at a time with a bar per file. The batch
 * summary and the inventory import follow when the last file has its outcome.
 */
@Component({
  selector: 'isl-intake-page',
  imports: [SelectOptionsFailure, 
    DecimalPipe,
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    BatchSummary,
    IntakeProgress,
    RecentBatches,
    UploadPanel,
  ],
  providers: [IntakeQueue],
  host: { '(window:beforeunload)': 'warnBeforeUnload($event)' },
  templateUrl: './intake-page.html',
  styleUrl: './intake-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IntakePage implements SendsFiles {
  private readonly intakeApi = inject(IntakeApi);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly queue = inject(IntakeQueue);

  protected readonly accepted = ACCEPTED;
  protected readonly stationOptions = loadSelectOptions(inject(StationsApi).listForSelect(), 'The stations');
  protected readonly stations = this.stationOptions.items;
  protected readonly chartFormOptions = loadSelectOptions(inject(ChartFormsApi).listForSelect(), 'The chart forms');
  protected readonly chartForms = this.chartFormOptions.items;
  protected readonly form = inject(NonNullableFormBuilder).group({
    label: [defaultLabel(new Date()), [Validators.required, Validators.maxLength(200)]],
    stationId: [''],
    chartFormId: [''],
  });

  protected readonly staged = signal<readonly File[]>([]);
  protected readonly inventories = signal<readonly File[]>([]);
  protected readonly suggestedInventory = computed(() => this.inventories().at(0) ?? null);
  protected readonly stagedBytes = computed(() => this.staged().reduce((sum, file) => sum + file.size, 0));
  protected readonly isDragOver = signal(false);
  protected readonly batchId = signal<string | null>(null);
  protected readonly summaryRefresh = signal(0);
  protected readonly failure = signal<string | null>(null);
  protected readonly isStarting = signal(false);

  isSending(): boolean {
    return this.isStarting() || this.queue.isRunning();
  }

  /** Closing the tab mid-run loses the unsent files; the browser asks (its own text) before it does. */
  protected warnBeforeUnload(event: BeforeUnloadEvent): void {
    if (this.isSending()) event.preventDefault();
  }

  protected pickFiles(event: Event): void {
    const input = event.target as HTMLInputElement;
    this.stage(Array.from(input.files ?? []));
    // Let the same files be picked again after a clear.
    input.value = '';
  }

  protected noteDragOver(event: DragEvent): void {
    event.preventDefault();
    this.isDragOver.set(true);
  }

  protected async dropFiles(event: DragEvent): Promise<void> {
    event.preventDefault();
    this.isDragOver.set(false);
    if (event.dataTransfer) this.stage(await filesFromDrop(event.dataTransfer));
  }

  protected clearStaged(): void {
    this.staged.set([]);
    this.inventories.set([]);
    this.queue.clear();
  }

  protected removeStaged(file: File): void {
    this.staged.update((files) => files.filter((f) => f !== file));
  }

  protected startIntake(): void {
    const files = this.staged();
    if (files.length === 0 || this.form.invalid || this.queue.isRunning()) {
      this.form.markAllAsTouched();
      return;
    }
    const { label, stationId, chartFormId } = this.form.getRawValue();
    const fields: IntakeFileFields = { stationId: stationId || undefined, chartFormId: chartFormId || undefined };
    this.failure.set(null);
    this.isStarting.set(true);
    this.queue.clear();
    this.intakeApi
      .createBatch(label.trim())
      .pipe(
        switchMap((batch) => {
          this.batchId.set(batch.id);
          this.staged.set([]);
          this.isStarting.set(false);
          return this.queue.run(batch.id, files, fields);
        }),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: () => this.summaryRefresh.update((n) => n + 1),
        error: (error: unknown) => {
          this.isStarting.set(false);
          this.failure.set(error instanceof ApiError ? error.message : 'The batch could not be created.');
        },
      });
  }

  protected startAnotherBatch(): void {
    this.batchId.set(null);
    this.queue.clear();
    this.inventories.set([]);
    this.form.controls.label.setValue(defaultLabel(new Date()));
  }

  private stage(files: File[]): void {
    const { scans, inventories } = sortSelection(files);
    const known = new Set(this.staged().map((f) => `${f.name}/${f.size}`));
    this.staged.update((staged) => [...staged, ...scans.filter((f) => !known.has(`${f.name}/${f.size}`))]);
    if (inventories.length > 0) this.inventories.set(inventories);
  }
}
