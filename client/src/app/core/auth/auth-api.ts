import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Person, SignInRequest, SignInResponse } from '@shared/api/auth';
import { API } from '@shared/api/routes';

@Injectable({ providedIn: 'root' })
export class AuthApi {
  private readonly http = inject(HttpClient);

  signIn(request: SignInRequest): Observable<SignInResponse> {
    return this.http.post<SignInResponse>(API.signIn, request);
  }

  me(): Observable<Person> {
    return this.http.get<Person>(API.me);
  }
}
