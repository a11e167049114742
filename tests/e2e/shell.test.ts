// The built app in Chromium: the shell renders in Work Sans, with no console errors and
// no request leaving 127.0.0.1.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser } from 'playwright-core';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { launchBrowser, openWatchedPage, signInThroughPage, saveScreenshot } from '../support/browser.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';

describe('app shell in the browser', () => {
  let t: TestApp;
  let browser: Browser;
  beforeAll(async () => {
    t = await startTestApp();
    const farm = await buildOrganization({ kind: 'farm', name: 'Shell Test Orchard' });
    await buildUser({ organization: farm, role: 'owner', email: 'shell-owner@example.test', name: 'Shell Owner' });
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await t?.stop();
  });

  it('renders the signed-in shell in Work Sans with no console errors or outside requests', async () => {
    const { page, consoleErrors, externalRequests } = await openWatchedPage(browser);
    await signInThroughPage(page, t.baseUrl, 'shell-owner@example.test');
    await expect.poll(() => page.locator('header.pp-topbar').isVisible()).toBe(true);
    await expect.poll(() => page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(true);
    const fontFamily = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
    expect(fontFamily.split(',')[0].replace(/["']/g, '').trim()).toBe('Work Sans');
    const workSansLoaded = await page.evaluate(async () => {
      await document.fonts.ready;
      return document.fonts.check('16px "Work Sans"') && [...document.fonts].some((f) => f.family.includes('Work Sans') && f.status === 'loaded');
    });
    expect(workSansLoaded).toBe(true);
    await saveScreenshot(page, 'shell-desktop');
    expect(consoleErrors).toEqual([]);
    expect(externalRequests).toEqual([]);
  });
});
