import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { BatchSummary } from '../batch-summary/batch-summary';

/** One intake batch opened from the list: its summary and inventory import. */
@Component({
  selector: 'isl-batch-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, BatchSummary],
  template: `
    <section class="isl-page">
      <a mat-button routerLink="/archive/intake"><mat-icon>arrow_back</mat-icon> Intake</a>
      <isl-batch-summary [batchId]="batchId()" />
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BatchPage {
  /** From the route parameter. */
  readonly batchId = input.required<string>();
}
