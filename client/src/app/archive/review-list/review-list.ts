import { DatePipe, DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { ProgressGroup, TracingProgressRow } from '@shared/api/desk';
import { DEFAULT_PAGE_SIZE } from '@shared/api/paging';
import { correctionsAppliedInWords } from '@shared/api/correction-words';
import type { ReviewRow, ReviewState } from '@shared/api/review';

import { StationsApi } from '../../core/api/stations-api';
import { createPagedList } from '../../shared/paged-list/paged-list';
import { ReviewApi } from '../review-api';
import { loadSelectOptions } from '../../shared/select-options/select-options';
import { SelectOptionsFailure } from '../../shared/select-options/select-options-failure';

/** The archivist's Review: handed-in ink lines, oldest first, with what a decision needs; and tracing progress. */
@Component({
  selector: 'isl-review-list',
  imports: [SelectOptionsFailure, DatePipe, DecimalPipe, PercentPipe, FormsModule, RouterLink, MatTableModule, MatPaginatorModule, MatSelectModule, MatFormFieldModule, MatButtonToggleModule, MatButtonModule, MatIconModule, MatInputModule],
  templateUrl: './review-list.html',
  styles: `
    .filters { display: flex; flex-wrap: wrap; gap: 12px; }
    h2 { font: var(--mat-sys-title-medium); margin: 24px 0 8px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewList {
  private readonly reviewApi = inject(ReviewApi);

  protected readonly stationOptions = loadSelectOptions(inject(StationsApi).listForSelect(), 'The stations');
  protected readonly stations = this.stationOptions.items;
  protected readonly stationId = signal('');
  protected readonly state = signal<ReviewState>('handed_in');
  /** Chart start range, YYYY-MM-DD ('' for open); the server takes both ends inclusive. */
  protected readonly from = signal('');
  protected readonly to = signal('');
  protected readonly volunteer = signal<{ id: string; name: string } | null>(null);
  protected readonly columns = ['handedInAt', 'chart', 'volunteer', 'pins', 'span', 'quality', 'corrections', 'agreement', 'open'];
  /** A pure function, so the cell's words are the same wherever the corrections are named. */
  protected readonly correctionsInWords = correctionsAppliedInWords;
  private readonly list = createPagedList<ReviewRow, never>({
    initialQuery: { page: 0, pageSize: DEFAULT_PAGE_SIZE, direction: 'asc' },
    sortKeys: [],
    load: (query) =>
      this.reviewApi.list(query, {
        state: this.state(),
        stationId: this.stationId() || undefined,
        from: this.from() || undefined,
        to: this.to() || undefined,
        authorId: this.volunteer()?.id,
      }),
    failureMessage: 'The review list could not be loaded.',
  });
  protected readonly query = this.list.query;
  protected readonly rows = this.list.rows;
  protected readonly total = this.list.total;
  protected readonly failure = this.list.failure;

  protected readonly progressGroup = signal<ProgressGroup>('station');
  private readonly progressList = createPagedList<TracingProgressRow, never>({
    initialQuery: { page: 0, pageSize: 10, direction: 'asc' },
    sortKeys: [],
    load: (query) => this.reviewApi.progress(query, this.progressGroup()),
    failureMessage: 'The progress could not be loaded.',
  });
  protected readonly progressQuery = this.progressList.query;
  protected readonly progressRows = this.progressList.rows;
  protected readonly progressTotal = this.progressList.total;
  protected readonly progressColumns = ['place', 'received', 'ready', 'claimed', 'traced', 'approved'];

  protected filterBy(change: { stationId?: string; state?: ReviewState; from?: string; to?: string; volunteer?: { id: string; name: string } | null }): void {
    if (change.stationId !== undefined) this.stationId.set(change.stationId);
    if (change.state !== undefined) this.state.set(change.state);
    if (change.from !== undefined) this.from.set(change.from);
    if (change.to !== undefined) this.to.set(change.to);
    if (change.volunteer !== undefined) this.volunteer.set(change.volunteer);
    this.list.query.update((current) => ({ ...current, page: 0 }));
  }

  protected turnPage(event: PageEvent): void {
    this.list.turnPage(event);
  }

  protected groupProgress(group: ProgressGroup): void {
    this.progressGroup.set(group);
    this.progressList.query.update((current) => ({ ...current, page: 0 }));
  }

  protected turnProgressPage(event: PageEvent): void {
    this.progressList.turnPage(event);
  }
}
