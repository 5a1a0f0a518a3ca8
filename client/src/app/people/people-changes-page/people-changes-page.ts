import { DatePipe, JsonPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { DEFAULT_PAGE_SIZE } from '@shared/api/paging';
import type { PeopleChange } from '@shared/api/people';

import { createPagedList } from '../../shared/paged-list/paged-list';
import { PeopleApi } from '../people-api';

/** The people change log: every invitation, role, enabled-state, name and password change, newest first. */
@Component({
  selector: 'isl-people-changes-page',
  imports: [DatePipe, JsonPipe, RouterLink, MatTableModule, MatPaginatorModule],
  template: `
    <section class="isl-page">
      <h1 class="title">People change log</h1>
      <p class="isl-muted"><a routerLink="..">Back to People</a></p>
      @if (failure(); as failure) {
        <p class="isl-inline-error" role="alert">{{ failure }}</p>
      }
      <table mat-table class="isl-table" [dataSource]="rows()">
        <ng-container matColumnDef="at">
          <th mat-header-cell *matHeaderCellDef>When (UTC)</th>
          <td mat-cell *matCellDef="let change">{{ change.at | date: 'yyyy-MM-dd HH:mm' : 'UTC' }}</td>
        </ng-container>
        <ng-container matColumnDef="actor">
          <th mat-header-cell *matHeaderCellDef>By</th>
          <td mat-cell *matCellDef="let change">{{ change.actorName ?? 'by mailed link' }}</td>
        </ng-container>
        <ng-container matColumnDef="email">
          <th mat-header-cell *matHeaderCellDef>Account</th>
          <td mat-cell *matCellDef="let change">{{ change.email }}</td>
        </ng-container>
        <ng-container matColumnDef="action">
          <th mat-header-cell *matHeaderCellDef>Change</th>
          <td mat-cell *matCellDef="let change">{{ change.action.replaceAll('_', ' ') }}</td>
        </ng-container>
        <ng-container matColumnDef="changes">
          <th mat-header-cell *matHeaderCellDef>Before → after</th>
          <td mat-cell *matCellDef="let change">
            @for (field of fieldsOf(change); track field.name) {
              <div>{{ field.name }}: {{ field.before | json }} → {{ field.after | json }}</div>
            }
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let change; columns: columns" data-testid="people-change-row"></tr>
      </table>
      <mat-paginator [length]="total()" [pageIndex]="query().page" [pageSize]="query().pageSize" [pageSizeOptions]="[25, 50, 100]" (page)="turnPage($event)" aria-label="Change log pages" />
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeopleChangesPage {
  private readonly api = inject(PeopleApi);

  protected readonly columns = ['at', 'actor', 'email', 'action', 'changes'];
  private readonly list = createPagedList<PeopleChange, never>({
    initialQuery: { page: 0, pageSize: DEFAULT_PAGE_SIZE, direction: 'desc' },
    sortKeys: [],
    load: (query) => this.api.changes({ page: query.page, pageSize: query.pageSize, direction: 'asc' }),
    failureMessage: 'The change log could not be loaded.',
  });
  protected readonly query = this.list.query;
  protected readonly rows = this.list.rows;
  protected readonly total = this.list.total;
  protected readonly failure = this.list.failure;

  protected fieldsOf(change: PeopleChange): { name: string; before: unknown; after: unknown }[] {
    return Object.entries(change.changes).map(([name, value]) => ({ name, ...value }));
  }

  protected turnPage(event: PageEvent): void {
    this.list.turnPage(event);
  }
}
