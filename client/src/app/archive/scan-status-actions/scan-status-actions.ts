import { KeyValuePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { SCAN_STATUS_LABELS, type ScanDetail, type ScanStatusChange } from '@shared/api/scans';

import { ScansApi } from '../../core/api/scans-api';
import { ApiError } from '../../core/http/api-error';

interface StatusProblem {
  message: string;
  details: Record<string, string>;
}

/** The fields a scan needs before it may be traced (the server checks the same and names what is missing). */
export function missingForTracing(scan: ScanDetail): string[] {
  const missing: string[] = [];
  if (!scan.stationId) missing.push('station');
  if (!scan.chartFormId) missing.push('chart form');
  if (!scan.chartStart) missing.push('chart start');
  if (scan.derivativeState !== 'ready') missing.push('derivatives');
  return missing;
}

/** Moves a scan along its states: ready to trace, withdraw with a reason, restore a withdrawn scan. */
@Component({
  selector: 'isl-scan-status-actions',
  imports: [KeyValuePipe, FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  template: `
    <div class="actions" data-testid="scan-status-actions">
      <p class="now">Now <b>{{ labels[scan().status] }}</b>.</p>
      @if (scan().status === 'withdrawn') {
        <p class="isl-muted">Withdrawn because: {{ scan().withdrawnReason }}</p>
        <button mat-flat-button type="button" [disabled]="isBusy()" (click)="change({ status: 'received' })" data-testid="status-restore"><mat-icon>restore</mat-icon> Restore to received</button>
      } @else {
        @if (scan().status === 'received') {
          @if (missing().length > 0) {
            <p class="isl-muted">Before it can be traced it needs: {{ missing().join(', ') }}.</p>
          }
          <button mat-flat-button type="button" [disabled]="isBusy() || missing().length > 0" (click)="change({ status: 'ready_to_trace' })" data-testid="status-ready"><mat-icon>task_alt</mat-icon> Ready to trace</button>
        }
        @if (scan().status === 'ready_to_trace') {
          <button mat-stroked-button type="button" [disabled]="isBusy()" (click)="change({ status: 'received' })" data-testid="status-back"><mat-icon>undo</mat-icon> Back to received</button>
        }
        <div class="withdraw">
          <mat-form-field class="reason">
            <mat-label>Reason to withdraw</mat-label>
            <textarea matInput rows="2" [(ngModel)]="reason" placeholder="e.g. a second copy of box 3 item 12; illegible" data-testid="status-reason"></textarea>
          </mat-form-field>
          <button mat-stroked-button type="button" class="danger" [disabled]="isBusy() || reason().trim() === ''" (click)="change({ status: 'withdrawn', reason: reason().trim() })" data-testid="status-withdraw">
            <mat-icon>block</mat-icon> Withdraw
          </button>
        </div>
      }
      @if (problem(); as problem) {
        <p class="isl-inline-error" role="alert" data-testid="status-problem">
          {{ problem.message }}
          @for (detail of problem.details | keyvalue; track detail.key) {
            <br />{{ detail.key }}: {{ detail.value }}
          }
        </p>
      }
    </div>
  `,
  styles: `
    .actions { display: flex; flex-direction: column; align-items: flex-start; gap: 8px; padding-top: 12px; }
    .now { margin: 0; font: var(--mat-sys-body-large); }
    .withdraw { display: flex; flex-direction: column; align-items: flex-start; gap: 6px; width: 100%; margin-top: 12px; }
    .reason { width: 100%; }
    .danger { color: var(--mat-sys-error); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ScanStatusActions {
  private readonly scansApi = inject(ScansApi);
  private readonly destroyRef = inject(DestroyRef);

  readonly scan = input.required<ScanDetail>();
  readonly changed = output<ScanDetail>();

  protected readonly labels = SCAN_STATUS_LABELS;
  protected readonly reason = signal('');
  protected readonly isBusy = signal(false);
  protected readonly problem = signal<StatusProblem | null>(null);
  protected readonly missing = computed(() => missingForTracing(this.scan()));

  protected change(change: ScanStatusChange): void {
    this.isBusy.set(true);
    this.problem.set(null);
    this.scansApi
      .changeStatus(this.scan().id, change)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (scan) => {
          this.isBusy.set(false);
          this.reason.set('');
          this.changed.emit(scan);
        },
        error: (error: unknown) => {
          this.isBusy.set(false);
          this.problem.set(error instanceof ApiError ? { message: error.message, details: error.details } : { message: 'The status could not be changed.', details: {} });
        },
      });
  }
}
