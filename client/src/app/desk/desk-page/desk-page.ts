import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { DEFAULT_PAGE_SIZE } from '@shared/api/paging';
import type { MyInkLineSummary } from '@shared/api/ink-lines';
import { SCAN_SORT_KEYS, type ScanSortKey, type ScanSummary } from '@shared/api/scans';

import { ScansApi } from '../../core/api/scans-api';
import { InkLinesApi } from '../../bench/ink-lines-api';
import { createPagedList } from '../../shared/paged-list/paged-list';

/** The volunteer's drafts (last touched first) and the charts ready to trace, each opening the Bench. */
@Component({
  selector: 'isl-desk-page',
  imports: [DatePipe, RouterLink, MatTableModule, MatSortModule, MatPaginatorModule, MatProgressBarModule, MatButtonModule, MatIconModule],
  templateUrl: './desk-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeskPage {
  private readonly scansApi = inject(ScansApi);
  private readonly inkLinesApi = inject(InkLinesApi);

  protected readonly columns = ['chartStart', 'stationName', 'chartFormName', 'inkLineCount', 'trace'];
  protected readonly draftColumns = ['updatedAt', 'chartStart', 'stationName', 'work', 'resume'];
  protected readonly drafts = createPagedList<MyInkLineSummary, never>({
    initialQuery: { page: 0, pageSize: 10, direction: 'desc' },
    sortKeys: [],
    load: (query) => this.inkLinesApi.myDrafts(query),
    failureMessage: 'Your drafts could not be loaded.',
  });
  private readonly list = createPagedList<ScanSummary, ScanSortKey>({
    initialQuery: { page: 0, pageSize: DEFAULT_PAGE_SIZE, sort: 'chartStart', direction: 'asc' },
    sortKeys: SCAN_SORT_KEYS,
    load: (query) => this.scansApi.list(query, { status: 'ready_to_trace' }),
    failureMessage: 'The Desk could not be loaded.',
  });
  protected readonly query = this.list.query;
  protected readonly isLoading = this.list.isLoading;
  protected readonly rows = this.list.rows;
  protected readonly total = this.list.total;
  protected readonly failure = this.list.failure;

  protected turnPage(event: PageEvent): void {
    this.list.turnPage(event);
  }

  protected turnDraftPage(event: PageEvent): void {
    this.drafts.turnPage(event);
  }

  protected sortBy(sort: Sort): void {
    this.list.sortBy(sort);
  }
}
