import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { MAX_PAGE_SIZE, type PageQuery } from '@shared/api/paging';
import type { ScanSortKey, ScanStatus, ScanStatusCounts, ScanSummary } from '@shared/api/scans';
import { catchError, map, of, switchMap } from 'rxjs';

import { ScansApi } from '../../core/api/scans-api';
import { BulkEditPanel } from '../bulk-edit-panel/bulk-edit-panel';
import { Catalogue } from '../catalogue/catalogue';
import { CatalogueFilterBar } from '../catalogue-filter-bar/catalogue-filter-bar';
import { StatusCounts } from '../status-counts/status-counts';
import { type CatalogueFilters, type CatalogueState, catalogueStateFromParams, paramsFromCatalogueState, scanFiltersOf, withoutStatus } from './catalogue-filters';

/**
 * The archivist's dashboard and catalogue. Filters, page and sort live in the address, so a filtered view
 * can be bookmarked, shared and reached back with the browser's Back button.
 */
@Component({
  selector: 'isl-catalogue-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, BulkEditPanel, Catalogue, CatalogueFilterBar, StatusCounts],
  template: `
    <section class="isl-page">
      <header class="isl-form-row header">
        <h1 class="title">Catalogue</h1>
        <span class="isl-muted" data-testid="catalogue-total">{{ catalogue.total() }} scans</span>
        @if (state().filters.batchId; as batchId) {
          <span class="batch-filter" data-testid="catalogue-batch-filter">
            one intake batch
            <button mat-icon-button type="button" aria-label="Show every batch" (click)="changeFilters({ batchId: null })"><mat-icon>close</mat-icon></button>
          </span>
          <button mat-button type="button" (click)="selectWholeBatch(batchId)" data-testid="catalogue-select-batch"><mat-icon>select_all</mat-icon> Select the whole batch</button>
        }
        <span class="spacer"></span>
        <a mat-flat-button routerLink="/archive/intake" data-testid="catalogue-intake-link"><mat-icon>move_to_inbox</mat-icon> Intake</a>
      </header>
      <isl-status-counts [counts]="counts()" [chosen]="state().filters.status" (statusChosen)="chooseStatus($event)" />
      <div class="filters"><isl-catalogue-filter-bar [filters]="state().filters" (filtersChange)="replaceFilters($event)" /></div>
      @if (selected().length > 0) {
        <isl-bulk-edit-panel [scans]="selected()" (applied)="afterBulkEdit(catalogue)" (closed)="selected.set([])" />
      }
      @if (selectionFailure(); as failure) {
        <p class="isl-inline-error" role="alert">{{ failure }}</p>
      }
      <isl-catalogue #catalogue [filters]="scanFilters()" [query]="state().query" (queryChange)="changeQuery($event)" [(selected)]="selected" />
    </section>
  `,
  styles: `
    .header { align-items: center; margin-bottom: 8px; }
    .title { font: var(--mat-sys-headline-small); margin: 0; }
    .spacer { flex: 1; }
    .filters { margin: 12px 0 0; }
    .batch-filter { display: inline-flex; align-items: center; padding-left: 10px; border-radius: 16px; background: var(--mat-sys-secondary-container); font: var(--mat-sys-label-large); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CataloguePage {
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly scansApi = inject(ScansApi);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly state = toSignal(this.route.queryParamMap.pipe(map(catalogueStateFromParams)), {
    initialValue: catalogueStateFromParams(this.route.snapshot.queryParamMap),
  });
  protected readonly scanFilters = computed(() => scanFiltersOf(this.state().filters), { equal: sameJson });
  private readonly countFilters = computed(() => scanFiltersOf(withoutStatus(this.state().filters)), { equal: sameJson });
  protected readonly counts = toSignal(
    toObservable(this.countFilters).pipe(
      switchMap((filters) => this.scansApi.statusCounts(filters).pipe(catchError(() => of<ScanStatusCounts | null>(null)))),
    ),
    { initialValue: null },
  );

  /** Scans ticked for a bulk edit. */
  protected readonly selected = signal<readonly ScanSummary[]>([]);
  protected readonly selectionFailure = signal<string | null>(null);

  /** Ticks every scan of the intake batch, not only the page on screen (up to one full page of the API). */
  protected selectWholeBatch(batchId: string): void {
    this.selectionFailure.set(null);
    this.scansApi
      .list({ page: 0, pageSize: MAX_PAGE_SIZE, sort: 'originalName', direction: 'asc' }, { batchId })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (page) => {
          this.selected.set(page.items);
          if (page.total > page.items.length) this.selectionFailure.set(`The first ${page.items.length} of the batch's ${page.total} scans are selected; apply, then select the rest.`);
        },
        error: () => this.selectionFailure.set('The batch could not be loaded to select it.'),
      });
  }

  protected afterBulkEdit(catalogue: Catalogue): void {
    this.selected.set([]);
    catalogue.reload();
  }

  protected chooseStatus(status: ScanStatus | null): void {
    this.changeFilters({ status });
  }

  protected changeFilters(change: Partial<CatalogueFilters>): void {
    this.replaceFilters({ ...this.state().filters, ...change });
  }

  protected replaceFilters(filters: CatalogueFilters): void {
    // New filters start from the first page; the sort stays.
    this.navigate({ filters, query: { ...this.state().query, page: 0 } });
  }

  protected changeQuery(query: PageQuery<ScanSortKey>): void {
    this.navigate({ ...this.state(), query });
  }

  private navigate(state: CatalogueState): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: paramsFromCatalogueState(state) });
  }
}

function sameJson(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}
