import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { DEFAULT_PAGE_SIZE } from '@shared/api/paging';
import { STATION_SORT_KEYS, type StationSortKey, type StationSummary } from '@shared/api/stations';

import { StationsApi } from '../../core/api/stations-api';
import { createPagedList } from '../../shared/paged-list/paged-list';
import { StationDialog, type StationDialogData } from '../station-dialog/station-dialog';

/** The stations register: every station with its identifiers, heights and time keeping. */
@Component({
  selector: 'isl-stations-page',
  imports: [DecimalPipe, RouterLink, MatButtonModule, MatIconModule, MatPaginatorModule, MatTableModule],
  template: `
    <section class="isl-page">
      <header class="isl-form-row header">
        <h1 class="title">Stations</h1>
        <span class="spacer"></span>
        <button mat-flat-button type="button" (click)="createStation()" data-testid="station-new"><mat-icon>add_location_alt</mat-icon> New station</button>
      </header>
      @if (stations.failure(); as failure) {
        <p class="isl-inline-error" role="alert">{{ failure }}</p>
      }
      <table mat-table class="isl-table" [dataSource]="stations.rows()">
        <ng-container matColumnDef="code">
          <th mat-header-cell *matHeaderCellDef>Code</th>
          <td mat-cell *matCellDef="let s"><a [routerLink]="['/archive/stations', s.id]">{{ s.code }}</a></td>
        </ng-container>
        <ng-container matColumnDef="name">
          <th mat-header-cell *matHeaderCellDef>Name</th>
          <td mat-cell *matCellDef="let s"><a [routerLink]="['/archive/stations', s.id]">{{ s.name }}</a></td>
        </ng-container>
        <ng-container matColumnDef="wigosId">
          <th mat-header-cell *matHeaderCellDef>WIGOS id</th>
          <td mat-cell *matCellDef="let s">{{ s.wigosId ?? '—' }}</td>
        </ng-container>
        <ng-container matColumnDef="position">
          <th mat-header-cell *matHeaderCellDef>Lat, lon (°)</th>
          <td mat-cell *matCellDef="let s">
            @if (s.latitude !== null && s.longitude !== null) { {{ s.latitude | number: '1.3-4' }}, {{ s.longitude | number: '1.3-4' }} } @else { — }
          </td>
        </ng-container>
        <ng-container matColumnDef="elevationM">
          <th mat-header-cell *matHeaderCellDef>Elevation (m)</th>
          <td mat-cell *matCellDef="let s">{{ s.elevationM ?? '—' }}</td>
        </ng-container>
        <ng-container matColumnDef="barometerHeightM">
          <th mat-header-cell *matHeaderCellDef>Barometer (m)</th>
          <td mat-cell *matCellDef="let s">{{ s.barometerHeightM ?? '—' }}</td>
        </ng-container>
        <ng-container matColumnDef="timeZone">
          <th mat-header-cell *matHeaderCellDef>Time zone</th>
          <td mat-cell *matCellDef="let s">{{ s.timeZone }}</td>
        </ng-container>
        <ng-container matColumnDef="timeStandard">
          <th mat-header-cell *matHeaderCellDef>Charts in</th>
          <td mat-cell *matCellDef="let s">{{ s.timeStandard === 'utc' ? 'UTC' : 'local standard' }}</td>
        </ng-container>
        <ng-container matColumnDef="edit">
          <th mat-header-cell *matHeaderCellDef><span class="cdk-visually-hidden">Edit</span></th>
          <td mat-cell *matCellDef="let s">
            <button mat-icon-button type="button" [attr.aria-label]="'Edit ' + s.name" (click)="editStation(s)"><mat-icon>edit</mat-icon></button>
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let s; columns: columns" data-testid="station-row"></tr>
        <tr class="mat-mdc-row" *matNoDataRow><td class="mat-mdc-cell" [attr.colspan]="columns.length">No stations yet.</td></tr>
      </table>
      <mat-paginator
        [length]="stations.total()"
        [pageIndex]="stations.query().page"
        [pageSize]="stations.query().pageSize"
        [pageSizeOptions]="[10, 25, 50]"
        (page)="stations.turnPage($event)"
        aria-label="Station pages"
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
export class StationsPage {
  private readonly stationsApi = inject(StationsApi);
  private readonly dialog = inject(MatDialog);

  protected readonly columns = ['code', 'name', 'wigosId', 'position', 'elevationM', 'barometerHeightM', 'timeZone', 'timeStandard', 'edit'];
  protected readonly stations = createPagedList<StationSummary, StationSortKey>({
    initialQuery: { page: 0, pageSize: DEFAULT_PAGE_SIZE, sort: 'name', direction: 'asc' },
    sortKeys: STATION_SORT_KEYS,
    load: (query) => this.stationsApi.list(query),
    failureMessage: 'The stations could not be loaded.',
  });

  protected createStation(): void {
    this.openDialog({ station: null });
  }

  protected editStation(station: StationSummary): void {
    this.openDialog({ station });
  }

  private openDialog(data: StationDialogData): void {
    this.dialog
      .open<StationDialog, StationDialogData, StationSummary>(StationDialog, { data, width: '680px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((saved) => {
        if (saved) this.stations.reload();
      });
  }
}
