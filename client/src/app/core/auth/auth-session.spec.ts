import { TestBed } from '@angular/core/testing';
import type { SignInResponse } from '@shared/api/auth';

import { AuthSession, SESSION_EXPIRED_MESSAGE } from './auth-session';

const HOUR_MS = 60 * 60 * 1000;

function signInResponse(expiresAtMs: number): SignInResponse {
  return {
    token: 'token-abc',
    expiresAt: new Date(expiresAtMs).toISOString(),
    person: { id: 'p1', email: 'archivist@isallo.test', displayName: 'Idris Fenwhistle', roles: ['archivist'] },
  };
}

describe('AuthSession', () => {
  beforeEach(() => localStorage.clear());

  it('when a person signs in, then the token and person are kept and stored for the next load', () => {
    const session = TestBed.inject(AuthSession);

    session.start(signInResponse(Date.now() + HOUR_MS));

    expect(session.isSignedIn()).toBe(true);
    expect(session.token()).toBe('token-abc');
    expect(session.person()?.displayName).toBe('Idris Fenwhistle');
    expect(JSON.parse(localStorage.getItem('isallo.session') ?? '{}').token).toBe('token-abc');
  });

  it('when a stored session has not expired, then a new load starts signed in', () => {
    localStorage.setItem('isallo.session', JSON.stringify(signInResponse(Date.now() + HOUR_MS)));

    const session = TestBed.inject(AuthSession);

    expect(session.isSignedIn()).toBe(true);
    expect(session.roles()).toEqual(['archivist']);
  });

  it('when a stored session has expired, then a new load starts signed out and forgets it', () => {
    localStorage.setItem('isallo.session', JSON.stringify(signInResponse(Date.now() - 1000)));

    const session = TestBed.inject(AuthSession);

    expect(session.isSignedIn()).toBe(false);
    expect(localStorage.getItem('isallo.session')).toBeNull();
  });

  it('when the stored entry is not JSON, then the session starts signed out', () => {
    localStorage.setItem('isallo.session', '{not json');

    const session = TestBed.inject(AuthSession);

    expect(session.isSignedIn()).toBe(false);
  });

  it('when the person signs out, then the token is gone from memory and storage', () => {
    const session = TestBed.inject(AuthSession);
    session.start(signInResponse(Date.now() + HOUR_MS));

    session.signOut();

    expect(session.token()).toBeNull();
    expect(localStorage.getItem('isallo.session')).toBeNull();
    expect(session.notice()).toBeNull();
  });

  it('when the session expires, then the person is signed out with the expiry notice', () => {
    const session = TestBed.inject(AuthSession);
    session.start(signInResponse(Date.now() + HOUR_MS));

    session.expire();

    expect(session.isSignedIn()).toBe(false);
    expect(session.notice()).toBe(SESSION_EXPIRED_MESSAGE);
  });

  it('when someone signs in after an expiry, then the notice is cleared', () => {
    const session = TestBed.inject(AuthSession);
    session.expire();

    session.start(signInResponse(Date.now() + HOUR_MS));

    expect(session.notice()).toBeNull();
  });

  it('when asked about roles, then only roles the person holds count', () => {
    const session = TestBed.inject(AuthSession);
    session.start(signInResponse(Date.now() + HOUR_MS));

    const results = [session.hasAnyRole(['archivist', 'admin']), session.hasAnyRole(['volunteer'])];

    expect(results).toEqual([true, false]);
  });
});
