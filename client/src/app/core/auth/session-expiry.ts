import { DestroyRef, effect, inject } from '@angular/core';
import { Router } from '@angular/router';

import { AuthSession } from './auth-session';

// setTimeout keeps delays in a signed 32-bit int; longer ones fire at once.
const LONGEST_TIMER_MS = 2 ** 31 - 1;

/** Signs out when the token's expiresAt passes, instead of waiting for the next 401. Call in an injection context. */
export function watchSessionExpiry(): void {
  const session = inject(AuthSession);
  const router = inject(Router);
  let timer: ReturnType<typeof setTimeout> | undefined;
  inject(DestroyRef).onDestroy(() => clearTimeout(timer));
  effect(() => {
    clearTimeout(timer);
    const expiresAtMs = session.expiresAtMs();
    if (expiresAtMs === null) return;
    const delayMs = Math.min(Math.max(expiresAtMs - Date.now(), 0), LONGEST_TIMER_MS);
    timer = setTimeout(() => endExpiredSession(session, router), delayMs);
  });
}

/** Signs out with the expiry notice and opens the sign-in screen. */
export function endExpiredSession(session: AuthSession, router: Router): void {
  session.expire();
  void router.navigateByUrl('/sign-in');
}
