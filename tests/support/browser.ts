// Debian's Chromium driven by playwright-core (never a downloaded browser). Every page
// fails its test on a request for a host other than 127.0.0.1 and records console errors.
import { chromium, type Browser, type BrowserContext, type Locator, type Page } from 'playwright-core';
import { mkdirSync } from 'node:fs';
import { resolve } from 'node:path';

export const screenshotDir = resolve('test-artifacts/screenshots');

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync',
      // No name but the loopback ones resolves, so nothing can leave the machine.
      '--host-resolver-rules=MAP * ~NOTFOUND, EXCLUDE localhost, EXCLUDE 127.0.0.1',
    ],
  });
}

export interface WatchedPage {
  page: Page;
  context: BrowserContext;
  consoleErrors: string[];
  externalRequests: string[];
}

/**
 * A page in a fresh context that records console errors and any request for another host
 * (the browser cannot reach one: see launchBrowser). The service worker is blocked unless asked for (`serviceWorkers: 'allow'`, the
 * offline field test): requests a worker answers bypass the context's routing, so the
 * outside-request watch and waits on API answers would not see them.
 */
export async function openWatchedPage(browser: Browser, options: { width?: number; height?: number; permissions?: string[]; serviceWorkers?: 'allow' | 'block' } = {}): Promise<WatchedPage> {
  const context = await browser.newContext({
    viewport: { width: options.width ?? 1280, height: options.height ?? 860 }, permissions: options.permissions, serviceWorkers: options.serviceWorkers ?? 'block',
  });
  const page = await context.newPage();
  const consoleErrors: string[] = [];
  const externalRequests: string[] = [];
  page.on('console', (msg) => { if (msg.type() === 'error') consoleErrors.push(msg.text()); });
  page.on('pageerror', (err) => consoleErrors.push(err.message));
  // Watched, not routed: routing every request through the driver made each page load slow.
  // The browser cannot reach another host anyway (launchBrowser's resolver rules).
  context.on('request', (request) => {
    const url = new URL(request.url());
    if (['127.0.0.1', 'localhost'].includes(url.hostname) || ['data:', 'blob:'].includes(url.protocol)) return;
    externalRequests.push(url.toString());
  });
  return { page, context, consoleErrors, externalRequests };
}

export async function signInThroughPage(page: Page, baseUrl: string, email: string, password = 'pollen-demo-2026') {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

/**
 * Starts watching for a passing element (a toast that leaves after a few seconds) before
 * the action that shows it, so a slow step in between cannot make the test miss it.
 * Resolves true once it was seen, false if it never showed within the time.
 */
export function watchFor(locator: Locator, timeout = 30_000): Promise<boolean> {
  return locator.first().waitFor({ state: 'visible', timeout }).then(() => true, () => false);
}

export async function saveScreenshot(page: Page, name: string) {
  mkdirSync(screenshotDir, { recursive: true });
  await page.screenshot({ path: resolve(screenshotDir, `${name}.png`), fullPage: true });
}

/**
 * Types a number into a PrimeVue InputNumber with key presses, as a person does: the field
 * takes keys as they come, while a value set in one go (Playwright's fill) waits for the
 * field to lose focus and can be put back by a re-render before that.
 */
export async function typeNumber(field: Locator, value: string | number) {
  await field.click();
  await field.press('ControlOrMeta+a');
  await field.pressSequentially(String(value));
}
