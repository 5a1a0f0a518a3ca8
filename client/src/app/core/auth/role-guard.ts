import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';
import type { Role } from '@shared/api/roles';

import { AuthSession } from './auth-session';

/**
 * Matches a route only for someone holding one of the roles, so a lazy area is not even loaded for others.
 * Everyone else goes home, where they land on an area they may use.
 */
export function roleGuard(roles: readonly Role[]): CanMatchFn {
  return () => {
    const session = inject(AuthSession);
    const router = inject(Router);
    if (!session.isSignedIn()) return router.parseUrl('/sign-in');
    return session.hasAnyRole(roles) || router.parseUrl('/');
  };
}
