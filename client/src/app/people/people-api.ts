import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { CapturedMail } from '@shared/api/mail';
import type { Page, PageQuery } from '@shared/api/paging';
import type { InvitationInput, InvitationSortKey, InvitationSummary, PeopleChange, PeopleSortKey, PersonPatch, PersonSummary } from '@shared/api/people';
import { API } from '@shared/api/routes';

import { toPageParams } from '../core/api/page-params';

@Injectable({ providedIn: 'root' })
export class PeopleApi {
  private readonly http = inject(HttpClient);

  list(query: PageQuery<PeopleSortKey>): Observable<Page<PersonSummary>> {
    return this.http.get<Page<PersonSummary>>(API.people, { params: toPageParams(query) });
  }

  update(personId: string, patch: PersonPatch): Observable<PersonSummary> {
    return this.http.patch<PersonSummary>(API.person(personId), patch);
  }

  /** Open invitations (pending and expired). */
  invitations(query: PageQuery<InvitationSortKey>): Observable<Page<InvitationSummary>> {
    return this.http.get<Page<InvitationSummary>>(API.invitations, { params: toPageParams(query) });
  }

  invite(input: InvitationInput): Observable<InvitationSummary> {
    return this.http.post<InvitationSummary>(API.invitations, input);
  }

  resend(invitationId: string): Observable<InvitationSummary> {
    return this.http.post<InvitationSummary>(API.invitationResend(invitationId), {});
  }

  withdraw(invitationId: string): Observable<void> {
    return this.http.delete<void>(API.invitation(invitationId));
  }

  changes(query: PageQuery): Observable<Page<PeopleChange>> {
    return this.http.get<Page<PeopleChange>>(API.peopleChanges, { params: toPageParams(query) });
  }

  capturedMails(query: PageQuery): Observable<Page<CapturedMail>> {
    return this.http.get<Page<CapturedMail>>(API.capturedMails, { params: new HttpParams().set('page', query.page).set('pageSize', query.pageSize) });
  }
}
