import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';

import { AuthSession } from './auth-session';

/** Lets the signed-in through; sends everyone else to the sign-in screen. */
export const signedInGuard: CanMatchFn = () => {
  const session = inject(AuthSession);
  return session.isSignedIn() || inject(Router).parseUrl('/sign-in');
};
