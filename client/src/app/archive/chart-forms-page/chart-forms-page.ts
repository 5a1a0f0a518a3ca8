import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { CHART_FORM_SORT_KEYS, type ChartFormSortKey, type ChartFormSummary } from '@shared/api/chart-forms';
import { DEFAULT_PAGE_SIZE } from '@shared/api/paging';

import { ChartFormsApi } from '../../core/api/chart-forms-api';
import { createPagedList } from '../../shared/paged-list/paged-list';

/** The library of printed chart types. */
@Component({
  selector: 'isl-chart-forms-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatPaginatorModule, MatTableModule],
  template: `
    <section class="isl-page">
      <header class="isl-form-row header">
        <h1 class="title">Chart forms</h1>
        <span class="spacer"></span>
        <a mat-flat-button routerLink="/archive/chart-forms/new" data-testid="chart-form-new"><mat-icon>add</mat-icon> New chart form</a>
      </header>
      @if (forms.failure(); as failure) {
        <p class="isl-inline-error" role="alert">{{ failure }}</p>
      }
      <table mat-table class="isl-table" [dataSource]="forms.rows()">
        <ng-container matColumnDef="name">
          <th mat-header-cell *matHeaderCellDef>Name</th>
          <td mat-cell *matCellDef="let f"><a [routerLink]="['/archive/chart-forms', f.id]">{{ f.name }}</a></td>
        </ng-container>
        <ng-container matColumnDef="range">
          <th mat-header-cell *matHeaderCellDef>Range</th>
          <td mat-cell *matCellDef="let f">{{ f.pressureMin }}–{{ f.pressureMax }} {{ f.pressureUnit }}</td>
        </ng-container>
        <ng-container matColumnDef="drum">
          <th mat-header-cell *matHeaderCellDef>Drum period</th>
          <td mat-cell *matCellDef="let f">{{ f.drumHours }} h</td>
        </ng-container>
        <ng-container matColumnDef="scale">
          <th mat-header-cell *matHeaderCellDef>Paper scale</th>
          <td mat-cell *matCellDef="let f">{{ f.mmPerHour }} mm/h · {{ f.mmPerUnit }} mm/{{ f.pressureUnit }}</td>
        </ng-container>
        <ng-container matColumnDef="arm">
          <th mat-header-cell *matHeaderCellDef>Pen arm</th>
          <td mat-cell *matCellDef="let f">{{ f.penArmRadiusMm === null ? 'straight lines' : f.penArmRadiusMm + ' mm' }}</td>
        </ng-container>
        <ng-container matColumnDef="scanCount">
          <th mat-header-cell *matHeaderCellDef>Scans</th>
          <td mat-cell *matCellDef="let f">{{ f.scanCount }}</td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let f; columns: columns" data-testid="chart-form-row"></tr>
        <tr class="mat-mdc-row" *matNoDataRow><td class="mat-mdc-cell" [attr.colspan]="columns.length">No chart forms yet.</td></tr>
      </table>
      <mat-paginator
        [length]="forms.total()"
        [pageIndex]="forms.query().page"
        [pageSize]="forms.query().pageSize"
        [pageSizeOptions]="[10, 25, 50]"
        (page)="forms.turnPage($event)"
        aria-label="Chart form pages"
      />
    </section>
  `,
  styles: `
    .header { align-items: center; margin-bottom: 8px; }
    .title { font: var(--mat-sys-headline-small); margin: 0; }
    .spacer { flex: 1; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChartFormsPage {
  protected readonly columns = ['name', 'range', 'drum', 'scale', 'arm', 'scanCount'];
  private readonly chartFormsApi = inject(ChartFormsApi);
  protected readonly forms = createPagedList<ChartFormSummary, ChartFormSortKey>({
    initialQuery: { page: 0, pageSize: DEFAULT_PAGE_SIZE, sort: 'name', direction: 'asc' },
    sortKeys: CHART_FORM_SORT_KEYS,
    load: (query) => this.chartFormsApi.list(query),
    failureMessage: 'The chart forms could not be loaded.',
  });
}
