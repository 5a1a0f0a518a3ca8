import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { IntakeBatchDetail } from '@shared/api/intake';
import type { ScanSummary } from '@shared/api/scans';
import { catchError, combineLatest, map, of, scan, startWith, switchMap } from 'rxjs';

import { ApiError } from '../../core/http/api-error';
import { IntakeApi } from '../intake-api';
import { InventoryImport } from '../inventory-import/inventory-import';

interface SummaryView {
  batch: IntakeBatchDetail | null;
  failure: string | null;
  isLoading: boolean;
}

/** A batch as the server recorded it: counts, every file's outcome and reason, its scans, and the inventory import. */
@Component({
  selector: 'isl-batch-summary',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule, InventoryImport],
  templateUrl: './batch-summary.html',
  styleUrl: './batch-summary.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BatchSummary {
  private readonly api = inject(IntakeApi);

  readonly batchId = input.required<string>();
  /** Bump to reload. */
  readonly refresh = input(0);
  /** An inventory CSV that came with the files, offered for import. */
  readonly suggestedInventory = input<File | null>(null);

  private readonly reloads = signal(0);
  protected readonly columns = ['fileName', 'outcome', 'scans', 'reason'];
  private readonly view = toSignal(
    combineLatest([toObservable(this.batchId), toObservable(this.refresh), toObservable(this.reloads)]).pipe(
      switchMap(([batchId]) =>
        this.api.getBatch(batchId).pipe(
          map((batch): SummaryView => ({ batch, failure: null, isLoading: false })),
          catchError((error: unknown) =>
            of<SummaryView>({ batch: null, isLoading: false, failure: error instanceof ApiError ? error.message : 'The batch could not be loaded.' }),
          ),
          startWith<SummaryView>({ batch: null, failure: null, isLoading: true }),
        ),
      ),
      // The last loaded batch stays on screen while a reload runs, so the summary does not flash empty.
      scan((previous, next) => (next.isLoading ? { ...next, batch: previous.batch } : next)),
    ),
    { initialValue: { batch: null, failure: null, isLoading: true } satisfies SummaryView },
  );
  protected readonly batch = computed(() => this.view().batch);
  protected readonly failure = computed(() => this.view().failure);
  protected readonly isLoading = computed(() => this.view().isLoading);
  protected readonly scansById = computed(() => new Map<string, ScanSummary>((this.batch()?.scans ?? []).map((scan) => [scan.id, scan])));

  protected reload(): void {
    this.reloads.update((n) => n + 1);
  }

  protected pageLabel(scan: ScanSummary | undefined, index: number): string {
    if (!scan) return `scan ${index + 1}`;
    return scan.pageCount > 1 ? `page ${scan.pageIndex + 1}` : 'scan';
  }
}
