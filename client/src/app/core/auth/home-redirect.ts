import { inject } from '@angular/core';
import { RedirectFunction, Router } from '@angular/router';

import { areasFor } from './areas';
import { AuthSession } from './auth-session';

/** `/` opens the first area the person may use; someone with no area at all sees the no-area note. */
export const homeRedirect: RedirectFunction = () => {
  const session = inject(AuthSession);
  const router = inject(Router);
  if (!session.isSignedIn()) return router.parseUrl('/sign-in');
  const [first] = areasFor(session.roles());
  return router.parseUrl(first ? `/${first.path}` : '/no-area');
};
