import type { Role } from '@shared/api/roles';

import type { AuthSession } from './auth-session';

/** Signs a test person in with the given roles for an hour (test helper for the guard specs). */
export function signInForTest(session: AuthSession, roles: Role[]): void {
  session.start({
    token: 'token-test',
    expiresAt: new Date(Date.now() + 60 * 60 * 1000).toISOString(),
    person: { id: 'p-test', email: 'test@isallo.test', displayName: 'Test Person', roles },
  });
}
