import { HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';

import { AuthSession } from '../auth/auth-session';

/** Adds the bearer token to API and IIIF calls while someone is signed in. */
export const authTokenInterceptor: HttpInterceptorFn = (request, next) => {
  const token = inject(AuthSession).token();
  const isOurs = request.url.startsWith('/api/') || request.url.startsWith('/iiif/');
  if (token === null || !isOurs) return next(request);
  return next(request.clone({ setHeaders: { Authorization: `Bearer ${token}` } }));
};
