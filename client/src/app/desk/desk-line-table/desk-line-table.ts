import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { DeskLine, DeskSection } from '@shared/api/desk';
import { DEFAULT_PAGE_SIZE } from '@shared/api/paging';

import { ScanThumbnail } from '../../shared/scan-thumbnail/scan-thumbnail';
import { createPagedList } from '../../shared/paged-list/paged-list';
import { DeskApi } from '../desk-api';

/** One section of the Desk (My drafts, Returned to me, Waiting for review): the volunteer's lines, paged on the server. */
@Component({
  selector: 'isl-desk-line-table',
  imports: [DatePipe, RouterLink, MatTableModule, MatPaginatorModule, MatButtonModule, MatIconModule, ScanThumbnail],
  template: `
    @if (failure(); as failure) {
      <p class="isl-inline-error" role="alert">{{ failure }}</p>
    }
    <table mat-table class="isl-table" [dataSource]="rows()" [attr.data-testid]="'desk-' + section() + '-table'">
      <ng-container matColumnDef="thumbnail">
        <th mat-header-cell *matHeaderCellDef><span class="cdk-visually-hidden">Scan</span></th>
        <td mat-cell *matCellDef="let line"><isl-scan-thumbnail [scanId]="line.scanId" [isReady]="true" /></td>
      </ng-container>
      <ng-container matColumnDef="chart">
        <th mat-header-cell *matHeaderCellDef>Chart</th>
        <td mat-cell *matCellDef="let line">
          <b>{{ line.stationName }}</b> · {{ line.chartStart | date: 'yyyy-MM-dd HH:mm' : 'UTC' }} UTC
          <div class="isl-muted">{{ line.originalName }}@if (line.box) { · box {{ line.box }} }</div>
          @if (line.returnNote) {
            <div class="note" data-testid="return-note">Archivist's note: {{ line.returnNote }}</div>
          }
        </td>
      </ng-container>
      <ng-container matColumnDef="updatedAt">
        <th mat-header-cell *matHeaderCellDef>Last change (UTC)</th>
        <td mat-cell *matCellDef="let line">{{ line.updatedAt | date: 'yyyy-MM-dd HH:mm' : 'UTC' }}</td>
      </ng-container>
      <ng-container matColumnDef="action">
        <th mat-header-cell *matHeaderCellDef><span class="cdk-visually-hidden">Action</span></th>
        <td mat-cell *matCellDef="let line">
          @if (section() === 'returned') {
            <button mat-flat-button type="button" (click)="rework.emit(line)" data-testid="rework"><mat-icon>edit</mat-icon> Rework</button>
          } @else if (section() === 'drafts') {
            <a mat-stroked-button [routerLink]="['/bench', line.scanId]" data-testid="open-draft"><mat-icon>draw</mat-icon> Open</a>
          }
        </td>
      </ng-container>
      <tr mat-header-row *matHeaderRowDef="columns"></tr>
      <tr mat-row *matRowDef="let line; columns: columns" data-testid="desk-line" [attr.data-ink-line-id]="line.inkLineId"></tr>
      <tr class="mat-mdc-row" *matNoDataRow>
        <td class="mat-mdc-cell" [attr.colspan]="columns.length">{{ emptyText() }}</td>
      </tr>
    </table>
    <mat-paginator [length]="total()" [pageIndex]="query().page" [pageSize]="query().pageSize" [pageSizeOptions]="[5, 10, 25]" (page)="turnPage($event)" [attr.aria-label]="section() + ' pages'" />
  `,
  styles: `
    .note { margin-top: 4px; color: var(--mat-sys-error); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeskLineTable {
  private readonly deskApi = inject(DeskApi);

  readonly section = input.required<DeskSection>();
  readonly emptyText = input('Nothing here.');
  readonly rework = output<DeskLine>();

  protected readonly columns = ['thumbnail', 'chart', 'updatedAt', 'action'];
  private readonly list = createPagedList<DeskLine, never>({
    initialQuery: { page: 0, pageSize: Math.min(DEFAULT_PAGE_SIZE, 5), direction: 'desc' },
    sortKeys: [],
    load: (query) => this.deskApi.lines(this.section(), query),
    failureMessage: 'This part of the Desk could not be loaded.',
  });
  protected readonly query = this.list.query;
  protected readonly rows = this.list.rows;
  protected readonly total = this.list.total;
  protected readonly failure = this.list.failure;

  protected turnPage(event: PageEvent): void {
    this.list.turnPage(event);
  }

  reload(): void {
    this.list.reload();
  }
}
