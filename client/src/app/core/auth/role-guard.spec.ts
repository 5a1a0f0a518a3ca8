import { TestBed } from '@angular/core/testing';
import { provideRouter, Router, UrlTree } from '@angular/router';

import { AuthSession } from './auth-session';
import { signInForTest } from './sign-in-for-test';
import { homeRedirect } from './home-redirect';
import { roleGuard } from './role-guard';

function urlOf(result: unknown): string {
  return TestBed.inject(Router).serializeUrl(result as UrlTree);
}

describe('roleGuard', () => {
  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([])] });
  });

  it('when the person holds one of the roles, then the area matches', () => {
    signInForTest(TestBed.inject(AuthSession), ['teacher']);

    const result = TestBed.runInInjectionContext(() => roleGuard(['climatologist', 'teacher'])({ path: 'series' }, []));

    expect(result).toBe(true);
  });

  it('when the person lacks the roles, then they are sent home', () => {
    signInForTest(TestBed.inject(AuthSession), ['volunteer']);

    const result = TestBed.runInInjectionContext(() => roleGuard(['archivist'])({ path: 'archive' }, []));

    expect(urlOf(result)).toBe('/');
  });

  it('when nobody is signed in, then they are sent to /sign-in', () => {
    const result = TestBed.runInInjectionContext(() => roleGuard(['admin'])({ path: 'people' }, []));

    expect(urlOf(result)).toBe('/sign-in');
  });
});

describe('homeRedirect', () => {
  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([])] });
  });

  it.each([
    [['archivist'], '/archive'],
    [['volunteer'], '/desk'],
    [['teacher'], '/lessons'], // Lessons is the teacher's home (issue 12),
    [['admin'], '/people'],
    [['admin', 'volunteer'], '/desk'],
  ] as const)('when the person holds %j, then home is %s', (roles, expectedUrl) => {
    signInForTest(TestBed.inject(AuthSession), [...roles]);

    const result = TestBed.runInInjectionContext(() => homeRedirect({} as never));

    expect(urlOf(result)).toBe(expectedUrl);
  });
});
