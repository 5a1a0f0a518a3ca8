import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { IntakeBatch } from '@shared/api/intake';
import { catchError, map, of, switchMap } from 'rxjs';

import { IntakeApi } from '../intake-api';

/** The last few intake batches, newest first, each opening its summary. */
@Component({
  selector: 'isl-recent-batches',
  imports: [DatePipe, RouterLink, MatIconModule],
  template: `
    <section class="recent" aria-labelledby="recent-heading">
      <h2 id="recent-heading" class="heading">Recent batches</h2>
      @for (batch of batches(); track batch.id) {
        <a class="batch" [routerLink]="['/archive/intake/batches', batch.id]" data-testid="recent-batch">
          <span class="label">{{ batch.label }}</span>
          <span class="isl-muted">{{ batch.createdAt | date: 'yyyy-MM-dd HH:mm' : 'UTC' }} · {{ batch.createdByName }}</span>
          <span class="counts">
            <span title="stored"><mat-icon>check_circle</mat-icon>{{ batch.counts.stored }}</span>
            <span title="duplicate"><mat-icon>content_copy</mat-icon>{{ batch.counts.duplicate }}</span>
            <span title="rejected"><mat-icon>error</mat-icon>{{ batch.counts.rejected }}</span>
            @if (batch.hasInventory) {
              <span title="inventory imported"><mat-icon>table_view</mat-icon></span>
            }
          </span>
        </a>
      } @empty {
        <p class="isl-muted">No batches yet.</p>
      }
    </section>
  `,
  styles: `
    .recent { padding: 12px 16px; border-radius: 12px; background: var(--mat-sys-surface-container-low); }
    .heading { font: var(--mat-sys-title-medium); margin: 0 0 8px; }
    .batch { display: flex; flex-direction: column; padding: 6px 0; border-bottom: 1px solid var(--mat-sys-outline-variant); color: inherit; text-decoration: none; }
    .batch:hover .label { text-decoration: underline; }
    .label { font: var(--mat-sys-body-medium); font-weight: 500; }
    .counts { display: flex; gap: 10px; font: var(--mat-sys-body-small); }
    .counts mat-icon { font-size: 14px; width: 14px; height: 14px; vertical-align: -2px; margin-right: 2px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecentBatches {
  private readonly api = inject(IntakeApi);
  /** Bump to reload. */
  readonly refresh = input(0);

  protected readonly batches = toSignal(
    toObservable(this.refresh).pipe(
      switchMap(() =>
        this.api.listBatches({ page: 0, pageSize: 8, sort: 'createdAt', direction: 'desc' }).pipe(
          map((page): IntakeBatch[] => page.items),
          catchError(() => of<IntakeBatch[]>([])),
        ),
      ),
    ),
    { initialValue: [] as IntakeBatch[] },
  );
}
