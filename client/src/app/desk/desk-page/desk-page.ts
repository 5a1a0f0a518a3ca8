import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { Router, RouterLink } from '@angular/router';
import type { DeskLine, DeskSummary } from '@shared/api/desk';

import { ApiError } from '../../core/http/api-error';
import { DeskApi } from '../desk-api';
import { DeskLineTable } from '../desk-line-table/desk-line-table';

/**
 * The volunteer's Desk: "Next chart" claims the queue's next chart (the archivist's priority, then oldest chart
 * first), the claim shows until it is handed in, given back or expires; below, My drafts, Returned to me (with the
 * archivist's note and Rework) and Waiting for review, and the approved count.
 */
@Component({
  selector: 'isl-desk-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatCardModule, MatIconModule, DeskLineTable],
  templateUrl: './desk-page.html',
  styles: `
    .queue { display: flex; flex-wrap: wrap; align-items: center; gap: 16px; margin-bottom: 16px; }
    .claim { margin-bottom: 16px; }
    .claim-actions { display: flex; gap: 8px; margin-top: 8px; }
    h2 { font: var(--mat-sys-title-medium); margin: 24px 0 8px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeskPage {
  private readonly deskApi = inject(DeskApi);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);
  private readonly returnedTable = viewChild<DeskLineTable>('returned');

  protected readonly summary = signal<DeskSummary | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly isBusy = signal(false);
  protected readonly queueWasEmpty = signal(false);

  constructor() {
    this.loadSummary();
  }

  protected takeNextChart(): void {
    this.isBusy.set(true);
    this.problem.set(null);
    this.deskApi
      .takeNext()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: ({ claim }) => {
          this.isBusy.set(false);
          this.queueWasEmpty.set(claim === null);
          this.loadSummary();
        },
        error: (error: unknown) => this.fail(error, 'No chart could be claimed.'),
      });
  }

  protected giveBack(scanId: string): void {
    this.isBusy.set(true);
    this.deskApi
      .giveBack(scanId)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: () => {
          this.isBusy.set(false);
          this.loadSummary();
        },
        error: (error: unknown) => this.fail(error, 'The chart could not be given back.'),
      });
  }

  /** Takes a returned line back as a draft and opens it on the Bench. */
  protected rework(line: DeskLine): void {
    this.isBusy.set(true);
    this.deskApi
      .rework(line.inkLineId, line.version)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: () => {
          this.isBusy.set(false);
          void this.router.navigate(['/bench', line.scanId]);
        },
        error: (error: unknown) => {
          this.fail(error, 'The line could not be reopened.');
          this.returnedTable()?.reload();
        },
      });
  }

  private loadSummary(): void {
    this.deskApi
      .summary()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({ next: (summary) => this.summary.set(summary), error: (error: unknown) => this.fail(error, 'The Desk could not be loaded.') });
  }

  private fail(error: unknown, fallback: string): void {
    this.isBusy.set(false);
    this.problem.set(error instanceof ApiError ? error.message : fallback);
  }
}
