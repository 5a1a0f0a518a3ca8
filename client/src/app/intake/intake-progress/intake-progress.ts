import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';

import type { IntakeItem, IntakeItemState } from '../intake-queue';

const STATE_ICONS: Record<IntakeItemState, string> = {
  waiting: 'schedule',
  sending: 'upload',
  stored: 'check_circle',
  duplicate: 'content_copy',
  rejected: 'error',
  cancelled: 'block',
};

/** The queue as a list: a bar per file while it is sent, then its outcome and, for a rejection, the reason. */
@Component({
  selector: 'isl-intake-progress',
  imports: [DecimalPipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './intake-progress.html',
  styleUrl: './intake-progress.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IntakeProgress {
  readonly items = input.required<readonly IntakeItem[]>();
  readonly overallPercent = input(0);
  readonly isRunning = input(false);
  readonly cancelled = output<void>();

  protected readonly icons = STATE_ICONS;
  protected readonly finishedCount = computed(() => this.items().filter((item) => item.state !== 'waiting' && item.state !== 'sending').length);
}
