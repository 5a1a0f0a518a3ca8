import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { SCAN_STATUS_LABELS, SCAN_STATUSES, type ScanStatus, type ScanStatusCounts } from '@shared/api/scans';

/** The archivist's dashboard: scans per status under the current filters; a click filters by that status. */
@Component({
  selector: 'isl-status-counts',
  template: `
    <div class="counts" role="group" aria-label="Scans per status">
      <button type="button" class="count all" [class.is-chosen]="chosen() === null" (click)="statusChosen.emit(null)" data-testid="status-count" data-status="all">
        <span class="number">{{ total() ?? '…' }}</span><span class="label">all</span>
      </button>
      @for (status of statuses; track status) {
        <button
          type="button"
          class="count"
          [class]="'count status-' + status"
          [class.is-chosen]="chosen() === status"
          [attr.aria-pressed]="chosen() === status"
          (click)="statusChosen.emit(chosen() === status ? null : status)"
          data-testid="status-count"
          [attr.data-status]="status"
        >
          <span class="number">{{ counts()?.[status] ?? '…' }}</span><span class="label">{{ labels[status] }}</span>
        </button>
      }
    </div>
  `,
  styles: `
    .counts { display: flex; flex-wrap: wrap; gap: 8px; }
    .count {
      display: flex; flex-direction: column; align-items: flex-start; min-width: 108px; padding: 6px 12px;
      border: 1px solid var(--mat-sys-outline-variant); border-radius: 10px; cursor: pointer;
      background: var(--mat-sys-surface-container-low); color: var(--mat-sys-on-surface); font-family: inherit;
      border-left-width: 5px;
    }
    .count:hover { background: var(--mat-sys-surface-container); }
    .count.is-chosen { outline: 2px solid var(--mat-sys-primary); outline-offset: -1px; }
    .number { font: var(--mat-sys-headline-small); line-height: 1.1; }
    .label { font: var(--mat-sys-label-medium); color: var(--mat-sys-on-surface-variant); }
    .status-received { border-left-color: var(--isl-status-received); }
    .status-ready_to_trace { border-left-color: var(--isl-status-ready_to_trace); }
    .status-traced { border-left-color: var(--isl-status-traced); }
    .status-approved { border-left-color: var(--isl-status-approved); }
    .status-withdrawn { border-left-color: var(--isl-status-withdrawn); }
    .all { border-left-color: var(--mat-sys-on-surface); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StatusCounts {
  readonly counts = input<ScanStatusCounts | null>(null);
  readonly chosen = input<ScanStatus | null>(null);
  readonly statusChosen = output<ScanStatus | null>();

  protected readonly statuses = SCAN_STATUSES;
  protected readonly labels = SCAN_STATUS_LABELS;
  protected readonly total = computed(() => {
    const counts = this.counts();
    return counts ? SCAN_STATUSES.reduce((sum, status) => sum + counts[status], 0) : null;
  });
}
