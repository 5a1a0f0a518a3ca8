import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router } from '@angular/router';
import { catchError, from, switchMap, throwError } from 'rxjs';

import { AuthSession } from '../auth/auth-session';
import { endExpiredSession } from '../auth/session-expiry';
import { readErrorBody, toApiError } from './api-error';

/**
 * Turns every HttpErrorResponse into an ApiError. A 401 for a signed-in person means the token is no
 * longer good, so the session ends and the sign-in screen says why. Unreachable servers and 5xx get a
 * snackbar here (nothing the screen could fix); 4xx answers are left to the screen to show inline.
 */
export const httpErrorInterceptor: HttpInterceptorFn = (request, next) => {
  const session = inject(AuthSession);
  const router = inject(Router);
  const snackBar = inject(MatSnackBar);
  return next(request).pipe(
    catchError((error: unknown) => {
      if (!(error instanceof HttpErrorResponse)) return throwError(() => error);
      return from(readErrorBody(error)).pipe(
        switchMap((body) => {
          const apiError = toApiError(error, body);
          const isSessionOver = apiError.code === 'token_expired' || apiError.code === 'unauthenticated' || apiError.code === 'session_ended';
          if (apiError.status === 401 && isSessionOver && session.isSignedIn()) endExpiredSession(session, router);
          if (apiError.status === 0 || apiError.status >= 500) snackBar.open(apiError.message, 'Dismiss', { duration: 8000 });
          return throwError(() => apiError);
        }),
      );
    }),
  );
};
