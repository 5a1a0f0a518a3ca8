import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { ChartFormSummary } from '@shared/api/chart-forms';
import { catchError, map, of } from 'rxjs';

import { ChartFormsApi } from '../../core/api/chart-forms-api';
import { ApiError } from '../../core/http/api-error';

/** The library of printed chart types. */
@Component({
  selector: 'isl-chart-forms-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatTableModule],
  template: `
    <section class="isl-page">
      <header class="isl-form-row header">
        <h1 class="title">Chart forms</h1>
        <span class="spacer"></span>
        <a mat-flat-button routerLink="/archive/chart-forms/new" data-testid="chart-form-new"><mat-icon>add</mat-icon> New chart form</a>
      </header>
      @if (view().failure; as failure) {
        <p class="isl-inline-error" role="alert">{{ failure }}</p>
      }
      <table mat-table class="isl-table" [dataSource]="view().forms">
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
  protected readonly view = toSignal(
    inject(ChartFormsApi)
      .listForSelect()
      .pipe(
        map((page) => ({ forms: page.items, failure: null as string | null })),
        catchError((error: unknown) => of({ forms: [] as ChartFormSummary[], failure: error instanceof ApiError ? error.message : 'The chart forms could not be loaded.' })),
      ),
    { initialValue: { forms: [] as ChartFormSummary[], failure: null as string | null } },
  );
}
