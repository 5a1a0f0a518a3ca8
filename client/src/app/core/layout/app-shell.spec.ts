import { BreakpointObserver } from '@angular/cdk/layout';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatNavListHarness } from '@angular/material/list/testing';
import { provideRouter, Router } from '@angular/router';
import type { Role } from '@shared/api/roles';
import { of } from 'rxjs';

import { AuthSession } from '../auth/auth-session';
import { signInForTest } from '../auth/sign-in-for-test';
import { AppShell } from './app-shell';

// jsdom has the dialog element but not its modal methods: open and close it by its attribute instead.
HTMLDialogElement.prototype.showModal ??= function (this: HTMLDialogElement) {
  this.setAttribute('open', '');
};
HTMLDialogElement.prototype.close ??= function (this: HTMLDialogElement) {
  this.removeAttribute('open');
};

async function openShellFor(roles: Role[]) {
  localStorage.clear();
  TestBed.configureTestingModule({
    providers: [provideRouter([]), { provide: BreakpointObserver, useValue: { observe: () => of({ matches: false, breakpoints: {} }) } }],
  });
  signInForTest(TestBed.inject(AuthSession), roles);
  const fixture = TestBed.createComponent(AppShell);
  await fixture.whenStable();
  return { fixture, harnesses: TestbedHarnessEnvironment.loader(fixture) };
}

describe('AppShell', () => {
  it('when a climatologist is signed in, then the navigation shows only Series', async () => {
    const { harnesses } = await openShellFor(['climatologist']);

    const items = await (await harnesses.getHarness(MatNavListHarness)).getItems();

    expect(await Promise.all(items.map((item) => item.getTitle()))).toEqual(['Series']);
  });

  it('when someone holds admin and archivist, then Archive and People are shown in area order', async () => {
    const { harnesses } = await openShellFor(['admin', 'archivist']);

    const items = await (await harnesses.getHarness(MatNavListHarness)).getItems();

    expect(await Promise.all(items.map((item) => item.getTitle()))).toEqual(['Archive', 'People']);
  });

  it('when sign out is pressed and confirmed, then the session ends and the sign-in screen opens', async () => {
    const { fixture, harnesses } = await openShellFor(['volunteer']);
    const navigateByUrl = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    const signOut = await harnesses.getHarness(MatButtonHarness.with({ text: /Sign out/ }));

    await signOut.click();
    await (await harnesses.getHarness(MatButtonHarness.with({ selector: '[data-testid="confirm-sign-out"]' }))).click();
    await fixture.whenStable();

    expect(TestBed.inject(AuthSession).isSignedIn()).toBe(false);
    expect(navigateByUrl).toHaveBeenCalledWith('/sign-in');
  });

  it('when sign out is pressed and the person stays, then the session goes on', async () => {
    const { fixture, harnesses } = await openShellFor(['volunteer']);
    const navigateByUrl = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);

    await (await harnesses.getHarness(MatButtonHarness.with({ text: /Sign out/ }))).click();
    await (await harnesses.getHarness(MatButtonHarness.with({ selector: '[data-testid="stay-signed-in"]' }))).click();
    await fixture.whenStable();

    expect(TestBed.inject(AuthSession).isSignedIn()).toBe(true);
    expect(navigateByUrl).not.toHaveBeenCalled();
  });

  it('when the page opens, then the first tab stop skips to the main landmark, before Sign out', async () => {
    const { fixture } = await openShellFor(['volunteer']);
    const element = fixture.nativeElement as HTMLElement;

    const focusable = [...element.querySelectorAll<HTMLElement>('a[href], button')];

    expect(focusable[0].dataset['testid']).toBe('skip-to-main');
    expect(element.querySelector('main#main')).not.toBeNull();
  });
});
