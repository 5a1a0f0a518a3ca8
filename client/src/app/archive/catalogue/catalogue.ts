import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, model, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink } from '@angular/router';
import { DEFAULT_PAGE_SIZE, type Page, type PageQuery } from '@shared/api/paging';
import { SCAN_SORT_KEYS, type ScanFilters, type ScanSortKey, type ScanSummary } from '@shared/api/scans';
import { catchError, combineLatest, map, Observable, of, scan, startWith, switchMap } from 'rxjs';

import { ScansApi } from '../../core/api/scans-api';
import { ApiError } from '../../core/http/api-error';
import { ScanStatusChip } from '../../shared/scan-status-chip/scan-status-chip';
import { ScanThumbnail } from '../../shared/scan-thumbnail/scan-thumbnail';

interface CatalogueView {
  page: Page<ScanSummary> | null;
  isLoading: boolean;
  failure: string | null;
}

/** While the worker makes some rows' images, look again this often (quietly: no progress bar). */
export const CATALOGUE_POLL_MS = 3000;

const DERIVATIVE_ICONS: Readonly<Record<string, string>> = { queued: 'schedule', working: 'autorenew', ready: 'image', failed: 'broken_image' };

/** Scans of the archive in a table, paged, sorted and filtered by the server. */
@Component({
  selector: 'isl-catalogue',
  imports: [DatePipe, RouterLink, MatCheckboxModule, MatTableModule, MatSortModule, MatPaginatorModule, MatProgressBarModule, MatIconModule, MatTooltipModule, ScanStatusChip, ScanThumbnail],
  templateUrl: './catalogue.html',
  styleUrl: './catalogue.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Catalogue {
  private readonly scansApi = inject(ScansApi);

  readonly filters = input<ScanFilters>({});
  /** Page and sort; two-way so the page can keep them in the address. */
  readonly query = model<PageQuery<ScanSortKey>>({ page: 0, pageSize: DEFAULT_PAGE_SIZE, sort: 'uploadedAt', direction: 'desc' });

  /** Rows ticked for a bulk edit; kept across pages and sorts until the page clears them. */
  readonly selected = model<readonly ScanSummary[]>([]);

  protected readonly columns = ['select', 'thumbnail', 'chartStart', 'stationName', 'chartFormName', 'originalName', 'tags', 'status', 'derivativeState', 'inkLineCount', 'uploadedAt'];
  protected readonly derivativeIcons = DERIVATIVE_ICONS;
  /** Bumped to reload; `quiet` reloads keep the progress bar still (they only refresh states). */
  private readonly reloads = signal({ count: 0, quiet: false });

  private readonly view = toSignal(
    combineLatest([toObservable(this.query), toObservable(this.filters), toObservable(this.reloads)]).pipe(
      switchMap(([query, filters, reload]) => {
        const answer: Observable<CatalogueView> = this.scansApi.list(query, filters).pipe(
          map((page): CatalogueView => ({ page, isLoading: false, failure: null })),
          catchError((error: unknown) => of<CatalogueView>({ page: null, isLoading: false, failure: describe(error) })),
        );
        return reload.quiet ? answer : answer.pipe(startWith<CatalogueView>({ page: null, isLoading: true, failure: null }));
      }),
      // Keep the last page on screen while the next one loads, so the table does not flash empty.
      scan((previous, next) => (next.isLoading ? { ...next, page: previous.page } : next)),
    ),
    { initialValue: { page: null, isLoading: true, failure: null } satisfies CatalogueView },
  );
  protected readonly page = computed(() => this.view().page);
  protected readonly rows = computed(() => this.page()?.items ?? []);
  readonly total = computed(() => this.page()?.total ?? 0);
  protected readonly isLoading = computed(() => this.view().isLoading);
  protected readonly failure = computed(() => this.view().failure);

  constructor() {
    effect((onCleanup) => {
      const isBusy = this.rows().some((row) => row.derivativeState === 'queued' || row.derivativeState === 'working');
      if (!isBusy || this.isLoading()) return;
      const timer = setTimeout(() => this.reloads.update((r) => ({ count: r.count + 1, quiet: true })), CATALOGUE_POLL_MS);
      onCleanup(() => clearTimeout(timer));
    });
  }

  protected readonly selectedIds = computed(() => new Set(this.selected().map((scan) => scan.id)));
  protected readonly isWholePageSelected = computed(() => this.rows().length > 0 && this.rows().every((row) => this.selectedIds().has(row.id)));
  protected readonly isPartPageSelected = computed(() => !this.isWholePageSelected() && this.rows().some((row) => this.selectedIds().has(row.id)));

  protected toggleRow(scan: ScanSummary): void {
    this.selected.update((selected) => (selected.some((one) => one.id === scan.id) ? selected.filter((one) => one.id !== scan.id) : [...selected, scan]));
  }

  protected toggleWholePage(): void {
    const rows = this.rows();
    if (this.isWholePageSelected()) {
      const onPage = new Set(rows.map((row) => row.id));
      this.selected.update((selected) => selected.filter((one) => !onPage.has(one.id)));
    } else {
      this.selected.update((selected) => [...selected, ...rows.filter((row) => !this.selectedIds().has(row.id))]);
    }
  }

  reload(): void {
    this.reloads.update((r) => ({ count: r.count + 1, quiet: false }));
  }

  protected turnPage(event: PageEvent): void {
    this.query.update((query) => ({ ...query, page: event.pageIndex, pageSize: event.pageSize }));
  }

  protected sortBy(sort: Sort): void {
    const key = (SCAN_SORT_KEYS as readonly string[]).includes(sort.active) ? (sort.active as ScanSortKey) : undefined;
    this.query.update((query) => ({
      ...query,
      page: 0,
      sort: sort.direction === '' ? undefined : key,
      direction: sort.direction === '' ? 'asc' : sort.direction,
    }));
  }
}

function describe(error: unknown): string {
  return error instanceof ApiError ? error.message : 'The catalogue could not be loaded.';
}
