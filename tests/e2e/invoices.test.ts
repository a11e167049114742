// In the browser: the beekeeper drafts and issues the invoice for a delivered agreement,
// the grower pays it on the payments stand-in's test page, and both see it paid.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser } from 'playwright-core';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { launchBrowser, openWatchedPage, signInThroughPage, saveScreenshot } from '../support/browser.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildBillableSeason } from '../support/builders/invoices.js';

describe('invoices in the browser', () => {
  let t: TestApp;
  let browser: Browser;
  beforeAll(async () => {
    t = await startTestApp();
    const farm = await buildOrganization({ kind: 'farm', name: 'Thistledown Orchard', billingEmail: 'books@thistledown.test' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Copperwing Apiary' });
    await buildUser({ organization: farm, role: 'owner', email: 'grower@thistledown.test', name: 'Wren Alder' });
    await buildUser({ organization: apiary, role: 'owner', email: 'keeper@copperwing.test', name: 'Basil Thorne' });
    // 12 colonies x $70.00 = $840.00, no tax; delivered now.
    await buildBillableSeason({ farm, apiary, colonies: 12, deliveredAt: new Date(), pricePerColonyCents: 7000 });
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await t?.stop();
  });

  // Two signed-in browsers and the payment page: longer than one page's test.
  it('issues, pays through the test payment page and shows the invoice paid on both sides', { timeout: 120_000 }, async () => {
    const keeper = await openWatchedPage(browser);
    await signInThroughPage(keeper.page, t.baseUrl, 'keeper@copperwing.test');
    await keeper.page.goto(`${t.baseUrl}/invoices`);
    await keeper.page.getByRole('button', { name: 'Draft invoice for Thistledown Orchard' }).click();
    await keeper.page.waitForURL(/\/invoices\/[0-9a-f-]{36}$/);
    await expect.poll(() => keeper.page.getByRole('heading', { level: 1, name: 'Draft invoice' }).isVisible()).toBe(true);
    await keeper.page.getByRole('button', { name: 'Issue invoice' }).click();
    await expect.poll(() => keeper.page.getByRole('heading', { level: 1, name: 'Invoice INV-00001' }).isVisible()).toBe(true);
    await expect.poll(() => keeper.page.getByTestId('invoice-outstanding').textContent()).toContain('$840.00');
    const invoiceUrl = keeper.page.url();

    const grower = await openWatchedPage(browser, { width: 360, height: 780 });
    await signInThroughPage(grower.page, t.baseUrl, 'grower@thistledown.test');
    await grower.page.goto(`${t.baseUrl}/invoices`);
    await grower.page.getByRole('link', { name: 'INV-00001' }).click();
    await grower.page.getByRole('button', { name: 'Pay $840.00 online' }).click();
    await grower.page.waitForURL(new RegExp(`^${t.payments.url}/pay/`));
    await expect.poll(() => grower.page.getByText('TEST PAYMENT').first().isVisible()).toBe(true);
    await saveScreenshot(grower.page, 'invoices-test-payment-page');
    await grower.page.getByRole('button', { name: 'Pay (test)' }).click();
    await grower.page.waitForURL((url) => url.toString().startsWith(invoiceUrl));
    await expect.poll(() => grower.page.locator('.pp-invoice-status').first().textContent()).toBe('Paid');
    await expect.poll(() => grower.page.getByTestId('invoice-outstanding').textContent()).toContain('$0.00');
    await saveScreenshot(grower.page, 'invoices-grower-paid-phone');

    // The beekeeper's open page follows the payment live.
    await expect.poll(() => keeper.page.locator('.pp-invoice-status').first().textContent(), { timeout: 10_000 }).toBe('Paid');
    await keeper.page.goto(`${t.baseUrl}/invoices`);
    await expect.poll(() => keeper.page.getByRole('row').filter({ hasText: 'INV-00001' }).locator('.pp-invoice-status').textContent()).toBe('Paid');
    await saveScreenshot(keeper.page, 'invoices-beekeeper-list');

    expect(keeper.consoleErrors).toEqual([]);
    expect(grower.consoleErrors).toEqual([]);
    expect(keeper.externalRequests).toEqual([]);
    expect(grower.externalRequests).toEqual([]);
  });
});
