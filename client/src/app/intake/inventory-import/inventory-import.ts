import { KeyValuePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { INVENTORY_COLUMNS, type InventoryMatch } from '@shared/api/intake';
import { from, switchMap } from 'rxjs';

import { ApiError } from '../../core/http/api-error';
import { IntakeApi } from '../intake-api';
import { InventoryResult } from '../inventory-result/inventory-result';
import { readFileText } from './read-file-text';

interface ImportProblem {
  message: string;
  details: Record<string, string>;
}

/** Imports the box inventory (CSV) for a batch and shows how its rows matched the batch's files. */
@Component({
  selector: 'isl-inventory-import',
  imports: [KeyValuePipe, MatButtonModule, MatIconModule, MatProgressBarModule, InventoryResult],
  templateUrl: './inventory-import.html',
  styleUrl: './inventory-import.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InventoryImport {
  private readonly api = inject(IntakeApi);
  private readonly destroyRef = inject(DestroyRef);

  readonly batchId = input.required<string>();
  readonly suggestedFile = input<File | null>(null);
  /** Emits after an import filled scans' metadata, so the summary can reload. */
  readonly imported = output<InventoryMatch>();

  protected readonly columns = INVENTORY_COLUMNS;
  protected readonly picked = signal<File | null>(null);
  protected readonly file = computed(() => this.picked() ?? this.suggestedFile());
  protected readonly isImporting = signal(false);
  protected readonly match = signal<InventoryMatch | null>(null);
  protected readonly problem = signal<ImportProblem | null>(null);

  protected pickFile(event: Event): void {
    const input = event.target as HTMLInputElement;
    this.picked.set(input.files?.item(0) ?? null);
    this.problem.set(null);
  }

  protected importInventory(): void {
    const file = this.file();
    if (!file) return;
    this.isImporting.set(true);
    this.problem.set(null);
    from(readFileText(file))
      .pipe(
        switchMap((csv) => this.api.importInventory(this.batchId(), csv)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (match) => {
          this.isImporting.set(false);
          this.match.set(match);
          this.imported.emit(match);
        },
        error: (error: unknown) => {
          this.isImporting.set(false);
          this.problem.set(error instanceof ApiError ? { message: error.message, details: error.details } : { message: 'The inventory could not be imported.', details: {} });
        },
      });
  }
}
