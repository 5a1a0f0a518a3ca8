import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { DEFAULT_PAGE_SIZE, type Page, type PageQuery } from '@shared/api/paging';
import { SCAN_SORT_KEYS, type ScanSortKey, type ScanSummary } from '@shared/api/scans';
import { catchError, map, of, switchMap } from 'rxjs';

import { ScansApi } from '../../core/api/scans-api';
import { ApiError } from '../../core/http/api-error';

/** The volunteer's list of charts ready to trace, each opening the Bench. */
@Component({
  selector: 'isl-desk-page',
  imports: [DatePipe, RouterLink, MatTableModule, MatSortModule, MatPaginatorModule, MatProgressBarModule, MatButtonModule, MatIconModule],
  templateUrl: './desk-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeskPage {
  private readonly scansApi = inject(ScansApi);

  protected readonly columns = ['periodStart', 'stationName', 'chartFormName', 'inkLineCount', 'trace'];
  protected readonly query = signal<PageQuery<ScanSortKey>>({ page: 0, pageSize: DEFAULT_PAGE_SIZE, sort: 'periodStart', direction: 'asc' });
  private readonly result = toSignal(
    toObservable(this.query).pipe(
      switchMap((query) =>
        this.scansApi.list(query, { status: 'ready_to_trace' }).pipe(
          map((page): { page: Page<ScanSummary> | null; failure: string | null } => ({ page, failure: null })),
          catchError((error: unknown) => of({ page: null, failure: error instanceof ApiError ? error.message : 'The Desk could not be loaded.' })),
        ),
      ),
    ),
  );
  protected readonly isLoading = computed(() => this.result() === undefined);
  protected readonly rows = computed(() => this.result()?.page?.items ?? []);
  protected readonly total = computed(() => this.result()?.page?.total ?? 0);
  protected readonly failure = computed(() => this.result()?.failure ?? null);

  protected turnPage(event: PageEvent): void {
    this.query.update((query) => ({ ...query, page: event.pageIndex, pageSize: event.pageSize }));
  }

  protected sortBy(sort: Sort): void {
    const key = (SCAN_SORT_KEYS as readonly string[]).includes(sort.active) ? (sort.active as ScanSortKey) : undefined;
    this.query.update((query) => ({ ...query, page: 0, sort: sort.direction === '' ? undefined : key, direction: sort.direction || 'asc' }));
  }
}
