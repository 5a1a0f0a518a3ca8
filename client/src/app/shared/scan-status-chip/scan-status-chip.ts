import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatChipsModule } from '@angular/material/chips';
import { SCAN_STATUS_LABELS, type ScanStatus } from '@shared/api/scans';

/** A scan's catalogue state as a small chip. */
@Component({
  selector: 'isl-scan-status-chip',
  imports: [MatChipsModule],
  template: `<mat-chip-set><mat-chip [disableRipple]="true" [class]="'status-' + status()" [attr.data-status]="status()">{{ label() }}</mat-chip></mat-chip-set>`,
  styles: `
    mat-chip { --mat-chip-container-height: 24px; }
    // Each state its own hue (theme: --isl-status-*); amber is for pins only.
    .status-received { --mat-chip-elevated-container-color: var(--isl-status-received-container); }
    .status-ready_to_trace { --mat-chip-elevated-container-color: var(--isl-status-ready_to_trace-container); }
    .status-traced { --mat-chip-elevated-container-color: var(--isl-status-traced-container); }
    .status-approved { --mat-chip-elevated-container-color: var(--isl-status-approved-container); }
    .status-withdrawn { --mat-chip-elevated-container-color: var(--isl-status-withdrawn-container); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ScanStatusChip {
  readonly status = input.required<ScanStatus>();
  protected readonly label = computed(() => SCAN_STATUS_LABELS[this.status()]);
}
