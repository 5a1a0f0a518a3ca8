import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { MePatch, PasswordChangeRequest, Person, SignInResponse } from '@shared/api/auth';
import type { InvitationAcceptance, InvitationPreview } from '@shared/api/people';
import { API } from '@shared/api/routes';

/** The person's own account, and the pages a mailed link opens (no sign-in needed for those). */
@Injectable({ providedIn: 'root' })
export class AccountApi {
  private readonly http = inject(HttpClient);

  invitation(token: string): Observable<InvitationPreview> {
    return this.http.get<InvitationPreview>(API.invitationByToken(token));
  }

  acceptInvitation(token: string, acceptance: InvitationAcceptance): Observable<SignInResponse> {
    return this.http.post<SignInResponse>(API.invitationAccept(token), acceptance);
  }

  requestPasswordReset(email: string): Observable<{ message: string }> {
    return this.http.post<{ message: string }>(API.passwordResetRequests, { email });
  }

  resetPassword(token: string, newPassword: string): Observable<SignInResponse> {
    return this.http.post<SignInResponse>(API.passwordResets, { token, newPassword });
  }

  changeName(patch: MePatch): Observable<Person> {
    return this.http.patch<Person>(API.me, patch);
  }

  changePassword(change: PasswordChangeRequest): Observable<SignInResponse> {
    return this.http.post<SignInResponse>(API.myPassword, change);
  }

  signOutEverywhere(): Observable<void> {
    return this.http.post<void>(API.signOutEverywhere, {});
  }
}
