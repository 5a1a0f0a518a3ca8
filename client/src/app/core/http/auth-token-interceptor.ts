import { HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';

import { AuthSession } from '../auth/auth-session';

/** Adds the bearer token to API calls while someone is signed in. */
export const authTokenInterceptor: HttpInterceptorFn = (request, next) => {
  const token = inject(AuthSession).token();
  if (token === null || !request.url.startsWith('/api/')) return next(request);
  return next(request.clone({ setHeaders: { Authorization: `Bearer ${token}` } }));
};
