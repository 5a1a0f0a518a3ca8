import { TestBed } from '@angular/core/testing';
import { provideRouter, Router, UrlTree } from '@angular/router';

import { AuthSession } from './auth-session';
import { signInForTest } from './sign-in-for-test';
import { signedInGuard } from './signed-in-guard';

function runGuard(): ReturnType<typeof signedInGuard> {
  return TestBed.runInInjectionContext(() => signedInGuard({ path: '' }, []));
}

describe('signedInGuard', () => {
  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([])] });
  });

  it('when nobody is signed in, then it redirects to /sign-in', () => {
    const result = runGuard();

    expect(result).toBeInstanceOf(UrlTree);
    expect(TestBed.inject(Router).serializeUrl(result as UrlTree)).toBe('/sign-in');
  });

  it('when someone is signed in, then it lets them through', () => {
    signInForTest(TestBed.inject(AuthSession), ['teacher']);

    const result = runGuard();

    expect(result).toBe(true);
  });
});
