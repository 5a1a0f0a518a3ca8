/// <reference lib="dom" />
/**
 * Accounts through the real UI with the local SMTP fake: the admin invites an address as a volunteer from the
 * People area, the invitee opens the link read from the captured mail, chooses a name and password, lands in
 * the Desk signed in with that role, and can sign in again later with the password chosen.
 */
import { rmSync } from 'node:fs';
import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';
import type { RunningServer } from '../../server/server';
import { startE2eServer } from '../helpers/e2e-server';
import { launchChromium, signIn, signOut, type BrowserSession } from '../helpers/browser';
import { waitForMailsTo } from '../helpers/mail';

jest.setTimeout(180_000);

describe('inviting a person', () => {
  let workDir: string;
  let server: RunningServer;
  let chromium: BrowserSession;

  beforeAll(async () => {
    ({ server, workDir } = await startE2eServer('people'));
    chromium = await launchChromium();
  });

  afterAll(async () => {
    await chromium?.close();
    await server?.close();
    rmSync(workDir, { recursive: true, force: true });
  });

  it('when the admin invites a volunteer and the invitee accepts from the mail, then the invitee is signed in with that role', async () => {
    // Arrange: an address of this run, so a rerun against the same database invites anew.
    const email = `new-volunteer-${Date.now()}@isallo.test`;
    const password = 'pen-arm-on-the-drum-31';
    const adminPage = await chromium.browser.newPage({ viewport: { width: 1440, height: 950 } });
    await signIn(adminPage, server.url, 'admin@isallo.test', DEMO_PASSWORD);
    await adminPage.getByTestId('nav-people').click();

    // Act 1: the admin invites the address with the volunteer role.
    await adminPage.getByTestId('invite-email').fill(email);
    await adminPage.getByTestId('invite-roles').click();
    await adminPage.getByRole('option', { name: 'volunteer' }).click();
    await adminPage.keyboard.press('Escape');
    await adminPage.locator('.mat-mdc-select-panel').waitFor({ state: 'detached' });
    await adminPage.getByTestId('send-invitation').click();
    await adminPage.getByTestId('invite-note').filter({ hasText: email }).waitFor();
    await adminPage.getByTestId('invitation-row').filter({ hasText: email }).waitFor();
    // The admin can read the same mail on the captured-mails page.
    await adminPage.getByTestId('captured-mails-link').click();
    await adminPage.getByTestId('captured-mail').filter({ hasText: email }).first().waitFor();

    // Act 2: the invitee opens the link from the mail the fake caught, in a browser of their own.
    const [mail] = await waitForMailsTo(email);
    const link = /https?:\/\/\S+\/invitation\/[A-Za-z0-9_-]+/.exec(mail!.text)?.[0];
    expect(link?.startsWith(server.url)).toBe(true);
    const invitee = await (await chromium.browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
    await invitee.goto(link!);
    await invitee.getByTestId('invitation-email').filter({ hasText: email }).waitFor();
    await invitee.getByTestId('invitation-name').fill('Tamsin Oakhurst');
    await invitee.getByTestId('invitation-password').fill(password);
    await invitee.getByTestId('accept-invitation').click();

    // Assert: signed in as the new volunteer, whose areas are the volunteer's; and the password works again.
    await invitee.getByTestId('sign-out').waitFor();
    expect(await invitee.getByTestId('person-name').innerText()).toContain('Tamsin Oakhurst');
    expect(await invitee.getByTestId('nav-people').count()).toBe(0);
    expect(await invitee.getByTestId('nav-desk').count()).toBe(1);
    await signOut(invitee);
    await signIn(invitee, server.url, email, password);
    expect(await invitee.getByTestId('nav-desk').count()).toBe(1);
  });
});
