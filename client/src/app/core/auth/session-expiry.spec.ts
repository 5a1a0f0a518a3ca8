import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';

import { AuthSession, SESSION_EXPIRED_MESSAGE } from './auth-session';
import { watchSessionExpiry } from './session-expiry';

describe('watchSessionExpiry', () => {
  beforeEach(() => {
    jest.useFakeTimers({ now: Date.parse('2026-03-02T10:00:00Z') });
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([])] });
  });

  afterEach(() => jest.useRealTimers());

  it('when expiresAt passes, then the person is signed out with the notice and sent to sign in', () => {
    const session = TestBed.inject(AuthSession);
    const navigateByUrl = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    TestBed.runInInjectionContext(() => watchSessionExpiry());
    session.start({
      token: 't',
      expiresAt: '2026-03-02T10:30:00Z',
      person: { id: 'p', email: 'teacher@isallo.test', displayName: 'Nell Ambrose', roles: ['teacher'] },
    });
    TestBed.tick();

    jest.advanceTimersByTime(29 * 60 * 1000);
    const isSignedInBefore = session.isSignedIn();
    jest.advanceTimersByTime(61 * 1000);

    expect(isSignedInBefore).toBe(true);
    expect(session.isSignedIn()).toBe(false);
    expect(session.notice()).toBe(SESSION_EXPIRED_MESSAGE);
    expect(navigateByUrl).toHaveBeenCalledWith('/sign-in');
  });
});
