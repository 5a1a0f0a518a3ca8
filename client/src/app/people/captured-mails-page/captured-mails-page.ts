import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { RouterLink } from '@angular/router';
import type { CapturedMail } from '@shared/api/mail';

import { createPagedList } from '../../shared/paged-list/paged-list';
import { PeopleApi } from '../people-api';

/**
 * The mails the local SMTP fake caught (development only: npm start runs the fake when SMTP_URL is not set),
 * so invitations and resets can be followed without a real mail server. The text part is shown, links and all.
 */
@Component({
  selector: 'isl-captured-mails-page',
  imports: [DatePipe, RouterLink, MatPaginatorModule],
  template: `
    <section class="isl-page">
      <h1 class="title">Captured mails</h1>
      <p class="isl-muted">Mail the local mail fake caught; a real mail server (SMTP_URL) sends them instead. <a routerLink="..">Back to People</a></p>
      @if (failure(); as failure) {
        <p class="isl-inline-error" role="alert">{{ failure }}</p>
      }
      @for (mail of rows(); track mail.id) {
        <article class="mail" data-testid="captured-mail">
          <h2>{{ mail.subject }}</h2>
          <p class="isl-muted">To {{ mail.to.join(', ') }} · {{ mail.receivedAt | date: 'yyyy-MM-dd HH:mm:ss' : 'UTC' }} UTC</p>
          <pre data-testid="captured-mail-text">{{ mail.text }}</pre>
        </article>
      } @empty {
        <p class="isl-muted">No mail yet.</p>
      }
      <mat-paginator [length]="total()" [pageIndex]="query().page" [pageSize]="query().pageSize" [pageSizeOptions]="[10, 25]" (page)="turnPage($event)" aria-label="Mail pages" />
    </section>
  `,
  styles: `
    .mail pre {
      white-space: pre-wrap;
      font: var(--mat-sys-body-medium);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CapturedMailsPage {
  private readonly api = inject(PeopleApi);

  private readonly list = createPagedList<CapturedMail, never>({
    initialQuery: { page: 0, pageSize: 10, direction: 'desc' },
    sortKeys: [],
    load: (query) => this.api.capturedMails(query),
    failureMessage: 'Captured mails could not be loaded.',
  });
  protected readonly query = this.list.query;
  protected readonly rows = this.list.rows;
  protected readonly total = this.list.total;
  protected readonly failure = this.list.failure;

  protected turnPage(event: PageEvent): void {
    this.list.turnPage(event);
  }
}
