import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatTableModule } from '@angular/material/table';
import { DEFAULT_PAGE_SIZE } from '@shared/api/paging';
import { INVITATION_SORT_KEYS, type InvitationSortKey, type InvitationSummary } from '@shared/api/people';

import { problemText } from '../../core/http/problem-text';
import { createPagedList } from '../../shared/paged-list/paged-list';
import { PeopleApi } from '../people-api';

/** Invitations not yet accepted (pending or expired), with resend and withdraw. */
@Component({
  selector: 'isl-invitation-list',
  imports: [DatePipe, MatTableModule, MatPaginatorModule, MatButtonModule],
  template: `
    <h2>Pending invitations</h2>
    @if (note(); as note) {
      <p role="status">{{ note }}</p>
    }
    @if (total() === 0) {
      <p class="isl-muted" data-testid="no-invitations">No open invitations.</p>
    } @else {
      <table mat-table class="isl-table" [dataSource]="rows()">
        <ng-container matColumnDef="email">
          <th mat-header-cell *matHeaderCellDef>E-mail</th>
          <td mat-cell *matCellDef="let invitation">{{ invitation.email }}</td>
        </ng-container>
        <ng-container matColumnDef="roles">
          <th mat-header-cell *matHeaderCellDef>Roles</th>
          <td mat-cell *matCellDef="let invitation">{{ invitation.roles.join(', ') }}</td>
        </ng-container>
        <ng-container matColumnDef="expiresAt">
          <th mat-header-cell *matHeaderCellDef>Link works until (UTC)</th>
          <td mat-cell *matCellDef="let invitation">
            {{ invitation.expiresAt | date: 'yyyy-MM-dd HH:mm' : 'UTC' }}
            @if (invitation.state === 'expired') {
              <strong> · expired</strong>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="actions">
          <th mat-header-cell *matHeaderCellDef><span class="cdk-visually-hidden">Actions</span></th>
          <td mat-cell *matCellDef="let invitation">
            <button mat-button type="button" (click)="resend(invitation)" data-testid="resend-invitation">Resend</button>
            <button mat-button type="button" (click)="withdraw(invitation)" data-testid="withdraw-invitation">Withdraw</button>
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let invitation; columns: columns" data-testid="invitation-row"></tr>
      </table>
      <mat-paginator [length]="total()" [pageIndex]="query().page" [pageSize]="query().pageSize" [pageSizeOptions]="[10, 25, 50]" (page)="turnPage($event)" aria-label="Invitation pages" />
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InvitationList {
  private readonly api = inject(PeopleApi);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly columns = ['email', 'roles', 'expiresAt', 'actions'];
  private readonly list = createPagedList<InvitationSummary, InvitationSortKey>({
    initialQuery: { page: 0, pageSize: DEFAULT_PAGE_SIZE, sort: 'sentAt', direction: 'desc' },
    sortKeys: INVITATION_SORT_KEYS,
    load: (query) => this.api.invitations(query),
    failureMessage: 'Invitations could not be loaded.',
  });
  protected readonly query = this.list.query;
  protected readonly rows = this.list.rows;
  protected readonly total = this.list.total;
  protected readonly note = signal<string | null>(null);

  reload(): void {
    this.list.reload();
  }

  protected turnPage(event: PageEvent): void {
    this.list.turnPage(event);
  }

  protected resend(invitation: InvitationSummary): void {
    this.api
      .resend(invitation.id)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: () => {
          this.note.set(`A new link went to ${invitation.email}; the earlier one no longer works.`);
          this.list.reload();
        },
        error: (error: unknown) => this.note.set(problemText(error, 'The invitation could not be resent.')),
      });
  }

  protected withdraw(invitation: InvitationSummary): void {
    this.api
      .withdraw(invitation.id)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: () => {
          this.note.set(`The invitation to ${invitation.email} is withdrawn.`);
          this.list.reload();
        },
        error: (error: unknown) => this.note.set(problemText(error, 'The invitation could not be withdrawn.')),
      });
  }
}
