import { chromium, type Browser, type Page } from 'playwright-core';

/** Flags that work on this machine's closed network (see DEVELOPERS.md). */
const CHROMIUM_FLAGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

export interface BrowserSession {
  browser: Browser;
  close(): Promise<void>;
}

/**
 * Launches Debian's Chromium headless (CHROMIUM_PATH comes from scripts/test.ts). Playwright gives every
 * launch a fresh, empty --user-data-dir of its own and removes it on close.
 */
export async function launchChromium(): Promise<BrowserSession> {
  const executablePath = process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium';
  const browser = await chromium.launch({ executablePath, headless: true, args: CHROMIUM_FLAGS });
  return { browser, close: () => browser.close() };
}

/** Signs in through the sign-in page and waits for the shell. */
export async function signIn(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByTestId('email').fill(email);
  await page.getByTestId('password').fill(password);
  await page.getByTestId('sign-in').click();
  await page.getByTestId('sign-out').waitFor();
}

/** Signs out through the toolbar, confirming in the dialog that asks first. */
export async function signOut(page: Page): Promise<void> {
  await page.getByTestId('sign-out').click();
  await page.getByTestId('confirm-sign-out').click();
  await page.getByTestId('sign-in').waitFor();
}

/** Picks an option of a Material select by its visible text. */
export async function chooseOption(page: Page, testId: string, optionText: string): Promise<void> {
  await page.getByTestId(testId).click();
  await page.getByRole('option', { name: optionText }).click();
  // The panel animates out; the next click must not land on its backdrop while it goes.
  await page.locator('.mat-mdc-select-panel').waitFor({ state: 'detached' });
}

/**
 * Waits until a Material dialog has finished opening. The dialog moves focus to its first field when its
 * open animation ends; text typed before then can land in that field instead of the one addressed.
 */
export async function waitForDialogReady(page: Page): Promise<void> {
  await page.waitForFunction(() => document.activeElement?.closest('mat-dialog-container') != null);
}
