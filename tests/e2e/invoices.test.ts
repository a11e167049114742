// In the browser: the beekeeper drafts and issues the invoice for a delivered agreement,
// the grower pays it on the payments stand-in's test page, and both see it paid. A second
// beekeeper's check for more than is owed is refused in dollars; a credit note corrects the
// issued invoice, and a check for what is then owed pays it; the grower sees it paid.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser } from 'playwright-core';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { launchBrowser, openWatchedPage, signInThroughPage, saveScreenshot, typeNumber } from '../support/browser.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildBillableSeason, buildInvoice } from '../support/builders/invoices.js';

describe('invoices in the browser', () => {
  let t: TestApp;
  let browser: Browser;
  let secondInvoiceId: string;
  beforeAll(async () => {
    t = await startTestApp();
    const farm = await buildOrganization({ kind: 'farm', name: 'Thistledown Orchard', billingEmail: 'books@thistledown.test' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Copperwing Apiary' });
    await buildUser({ organization: farm, role: 'owner', email: 'grower@thistledown.test', name: 'Wren Alder' });
    await buildUser({ organization: apiary, role: 'owner', email: 'keeper@copperwing.test', name: 'Basil Thorne' });
    // 12 colonies x $70.00 = $840.00, no tax; delivered now.
    await buildBillableSeason({ farm, apiary, colonies: 12, deliveredAt: new Date(), pricePerColonyCents: 7000 });
    // The second pair: 10 colonies x $50.00 = $500.00, issued.
    const farm2 = await buildOrganization({ kind: 'farm', name: 'Wintergreen Bench Farm' });
    const apiary2 = await buildOrganization({ kind: 'apiary', name: 'Ashgrove Hives' });
    await buildUser({ organization: farm2, role: 'owner', email: 'grower@wintergreen.test', name: 'Ivo Marsh' });
    await buildUser({ organization: apiary2, role: 'owner', email: 'keeper@ashgrove.test', name: 'Tamsin Reed' });
    const second = await buildBillableSeason({ farm: farm2, apiary: apiary2, colonies: 10, deliveredAt: new Date(), pricePerColonyCents: 5000, lon: -119.7, lat: 45.1 });
    secondInvoiceId = (await buildInvoice({ agreement: second.agreement, apiary: apiary2, issuedAt: new Date() })).id;
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

  it('refuses a check for more than is owed in dollars, corrects the invoice with a credit note, and records the right check', { timeout: 120_000 }, async () => {
    const keeper = await openWatchedPage(browser);
    const k = keeper.page;
    await signInThroughPage(k, t.baseUrl, 'keeper@ashgrove.test');
    await k.goto(`${t.baseUrl}/invoices/${secondInvoiceId}`);
    await expect.poll(() => k.getByTestId('invoice-outstanding').textContent()).toContain('$500.00');

    // A check for more than the $500.00 owed: refused, in dollars, and nothing recorded.
    const payment = k.getByRole('form', { name: 'Record a check or bank transfer' });
    await payment.locator('#payment-method').click();
    await k.getByRole('option', { name: 'Check' }).click();
    const amount = payment.getByLabel('Amount (USD)');
    await typeNumber(amount, '600');
    await payment.getByLabel('Reference (check number, transfer id)').fill('Check 2231');
    // As the form now holds it.
    await expect.poll(() => amount.inputValue()).toBe('$600.00');
    await payment.getByRole('button', { name: 'Record payment' }).click();
    // The whole form's text, so a failure shows what the form says instead.
    await expect.poll(() => payment.innerText()).toContain('must be at most $500.00');
    expect(await k.getByTestId('invoice-outstanding').textContent()).toContain('$500.00');

    const credit = k.getByRole('form', { name: 'Add a credit note' });
    await typeNumber(credit.getByLabel('Amount (USD)'), '50');
    await credit.getByLabel('What it corrects').fill('One colony arrived a week late');
    await credit.getByRole('button', { name: 'Add credit note' }).click();
    await expect.poll(() => k.getByTestId('invoice-outstanding').textContent()).toContain('$450.00');
    expect(await k.getByText(/CN-\d{5}/).first().isVisible()).toBe(true);

    // The payment form starts again from what is now owed; a check for that pays the invoice.
    await expect.poll(() => amount.inputValue()).toBe('$450.00');
    await payment.getByLabel('Reference (check number, transfer id)').fill('Check 2232');
    await payment.getByRole('button', { name: 'Record payment' }).click();
    await expect.poll(() => k.getByTestId('invoice-outstanding').textContent()).toContain('$0.00');
    await expect.poll(() => k.locator('.pp-invoice-status').first().textContent()).toBe('Paid');
    await saveScreenshot(k, 'invoices-credit-note-check');

    const grower = await openWatchedPage(browser, { width: 360, height: 780 });
    const g = grower.page;
    await signInThroughPage(g, t.baseUrl, 'grower@wintergreen.test');
    await g.goto(`${t.baseUrl}/invoices/${secondInvoiceId}`);
    await expect.poll(() => g.locator('.pp-invoice-status').first().textContent()).toBe('Paid');
    expect(await g.getByTestId('invoice-outstanding').textContent()).toContain('$0.00');
    expect(await g.getByText(/CN-\d{5}/).first().isVisible()).toBe(true);
    // The grower neither corrects nor records payments.
    expect(await g.getByRole('button', { name: 'Add credit note' }).count()).toBe(0);
    expect(await g.getByRole('button', { name: 'Record payment' }).count()).toBe(0);

    // The refused check is the beekeeper's one console error (the browser logs the 400).
    expect(keeper.consoleErrors).toEqual(['Failed to load resource: the server responded with a status of 400 (Bad Request)']);
    expect(grower.consoleErrors).toEqual([]);
    for (const watched of [keeper, grower]) expect(watched.externalRequests).toEqual([]);
  });
});
