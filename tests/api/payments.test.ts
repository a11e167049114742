// Paying invoices through the payment SDK and the local payments stand-in: checkout,
// full, partial and failed payments, signed webhooks (duplicate, out of order, badly
// signed), refunds, and cheques or transfers recorded by the beekeeper.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import Stripe from 'stripe';
import { DateTime } from 'luxon';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import type { Organization } from '../../server/src/db/models/organization.model.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildBillableSeason, buildBillingParties, buildInvoice } from '../support/builders/invoices.js';

describe('payments API', () => {
  let t: TestApp;
  let keeper: ApiClient;
  let grower: ApiClient;
  let farm: Organization;
  let apiary: Organization;
  const clock = new Date();
  const deliveredAt = clock; // the deposit falls due today, so nothing is overdue yet
  const todayThere = DateTime.fromJSDate(clock, { zone: 'America/Los_Angeles' }).toISODate()!; // the business's time zone

  beforeAll(async () => {
    t = await startTestApp({ now: () => clock });
    ({ farm, apiary } = await buildBillingParties({ farm: 'Amberlane Orchard', apiary: 'Sallowmead Bees', farmOwnerEmail: 'owner@amberlane.test', apiaryOwnerEmail: 'owner@sallowmead.test' }));
    keeper = await signedInClient(t.app, 'owner@sallowmead.test');
    grower = await signedInClient(t.app, 'owner@amberlane.test');
  });
  afterAll(async () => { await t?.stop(); });

  /** An issued invoice of 10 colonies x $60.00 = $600.00 (no tax), deposit 50% = $300.00. */
  async function issuedInvoice() {
    const season = await buildBillableSeason({ farm, apiary, colonies: 10, deliveredAt, pricePerColonyCents: 6000, lon: -119.9 + Math.random() });
    return buildInvoice({ agreement: season.agreement, apiary, issuedAt: clock });
  }

  const invoiceOf = async (id: string) => (await grower.get(`/api/invoices/${id}`).expect(200)).body.invoice;

  /** The card step on the stand-in's page, as the browser form posts it. */
  async function payOnPage(url: string, amount: string, outcome: 'pay' | 'decline' = 'pay') {
    return fetch(url, { method: 'POST', headers: { 'Content-Type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ amount, outcome }), redirect: 'manual' });
  }

  it('pays in full through a checkout session and the test payment page', async () => {
    const invoice = await issuedInvoice();
    const checkout = await grower.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(201);
    expect(checkout.body.url).toMatch(new RegExp(`^${t.payments.url}/pay/cs_test_`));
    const page = await (await fetch(checkout.body.url)).text();
    expect(page).toContain('TEST PAYMENT');
    expect(page).toContain('USD 600.00');
    expect((await invoiceOf(invoice.id)).status).toBe('issued'); // the browser's word alone changes nothing

    const paid = await payOnPage(checkout.body.url, '600.00');
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toMatch(new RegExp(`/invoices/${invoice.id}\\?payment=returned$`));
    const after = await invoiceOf(invoice.id);
    expect(after.status).toBe('paid');
    expect(after.paidCents).toBe(60_000);
    expect(after.payments).toEqual([expect.objectContaining({ method: 'online', state: 'succeeded', amountCents: 60_000 })]);
    await grower.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(409);
  });

  it('keeps a partly paid balance, and a declined card leaves the invoice unpaid', async () => {
    const invoice = await issuedInvoice();
    const { body } = await grower.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(201);
    const declined = await payOnPage(body.url, '600.00', 'decline');
    expect(declined.status).toBe(402);
    const unpaid = await invoiceOf(invoice.id);
    expect(unpaid.status).toBe('issued');
    expect(unpaid.paidCents).toBe(0);
    expect(unpaid.payments).toEqual([expect.objectContaining({ state: 'failed', failureMessage: expect.stringContaining('declined') })]);

    expect((await payOnPage(body.url, '250.00')).status).toBe(303);
    const partly = await invoiceOf(invoice.id);
    // $600.00 - $250.00 = $350.00 outstanding.
    expect(partly.paidCents).toBe(25_000);
    expect(partly.outstandingCents).toBe(35_000);
    expect(partly.status).toBe('partly-paid');

    const second = await grower.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(201);
    expect(t.payments.sessions.get(second.body.url.split('/').pop())?.amount_total).toBe(35_000);
    expect((await payOnPage(second.body.url, '400.00')).status).toBe(400); // more than is due
    expect((await payOnPage(second.body.url, '350.00')).status).toBe(303);
    expect((await invoiceOf(invoice.id)).status).toBe('paid');
  });

  it('counts a duplicate delivery and a late failure event once, never moving a paid invoice back', async () => {
    const invoice = await issuedInvoice();
    const { body } = await grower.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(201);
    await payOnPage(body.url, '600.00');
    const succeeded = t.payments.events.find((e) => e.type === 'payment_intent.succeeded' && (e.data.object.metadata as Record<string, string>).invoice_id === invoice.id)!;
    expect(await t.payments.redeliver(succeeded)).toBe(200);
    expect(await t.payments.redeliver(succeeded)).toBe(200);
    // The same payment reported again under a new event id counts once too.
    expect((await t.payments.sendEvent('payment_intent.succeeded', succeeded.data.object)).status).toBe(200);
    // A failure about the same payment arriving after its success changes nothing.
    const late = await t.payments.sendEvent('payment_intent.payment_failed', { ...succeeded.data.object, status: 'requires_payment_method', last_payment_error: { message: 'late' } });
    expect(late.status).toBe(200);
    const after = await invoiceOf(invoice.id);
    expect(after.paidCents).toBe(60_000);
    expect(after.status).toBe('paid');
    expect(after.payments).toHaveLength(1);
    expect(after.payments[0].state).toBe('succeeded');
  });

  it('keeps a refund that arrives before its payment, and counts it once the payment succeeds', async () => {
    const invoice = await issuedInvoice();
    const intent = { id: 'pi_test_early_refund', object: 'payment_intent', amount: 60_000, amount_received: 60_000, currency: 'usd', status: 'succeeded', metadata: { invoice_id: invoice.id } };
    await t.payments.sendEvent('refund.created', { id: 're_test_early', object: 'refund', amount: 10_000, status: 'succeeded', payment_intent: intent.id, metadata: { invoice_id: invoice.id } });
    expect((await invoiceOf(invoice.id)).paidCents).toBe(0);
    await t.payments.sendEvent('payment_intent.succeeded', intent);
    // $600.00 received - $100.00 refunded = $500.00.
    expect((await invoiceOf(invoice.id)).paidCents).toBe(50_000);
    // A late "pending" report of the same refund does not undo it.
    await t.payments.sendEvent('refund.updated', { id: 're_test_early', object: 'refund', amount: 10_000, status: 'pending', payment_intent: intent.id, metadata: { invoice_id: invoice.id } });
    expect((await invoiceOf(invoice.id)).paidCents).toBe(50_000);
  });

  it('answers 400 to a badly signed or altered event and changes nothing', async () => {
    const invoice = await issuedInvoice();
    const intent = { id: 'pi_test_forged', object: 'payment_intent', amount: 60_000, amount_received: 60_000, currency: 'usd', status: 'succeeded', metadata: { invoice_id: invoice.id } };
    const event = { id: 'evt_test_forged', object: 'event', type: 'payment_intent.succeeded', created: Math.floor(Date.now() / 1000), data: { object: intent } };
    const payload = JSON.stringify(event);
    const signer = new Stripe('sk_test_other');
    const url = `${t.baseUrl}/api/webhooks/payments`;
    const post = (body: string, signature?: string) =>
      fetch(url, { method: 'POST', headers: { 'Content-Type': 'application/json', ...(signature ? { 'Stripe-Signature': signature } : {}) }, body });

    expect((await post(payload)).status).toBe(400);
    expect((await post(payload, signer.webhooks.generateTestHeaderString({ payload, secret: 'whsec_wrong' }))).status).toBe(400);
    const goodHeader = signer.webhooks.generateTestHeaderString({ payload, secret: t.config.payments.webhookSecret });
    const altered = payload.replace('"amount_received":60000', '"amount_received":99999');
    expect((await post(altered, goodHeader)).status).toBe(400);
    const stale = signer.webhooks.generateTestHeaderString({ payload, secret: t.config.payments.webhookSecret, timestamp: Math.floor(Date.now() / 1000) - 3600 });
    expect((await post(payload, stale)).status).toBe(400);
    expect((await invoiceOf(invoice.id)).paidCents).toBe(0);
    // The same event correctly signed is taken (the signature, not the sender, is what counts).
    expect((await post(payload, goodHeader)).status).toBe(200);
    expect((await invoiceOf(invoice.id)).paidCents).toBe(60_000);
  });

  it('refunds part of an online payment once the refund webhook confirms it', async () => {
    const invoice = await issuedInvoice();
    const { body } = await grower.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(201);
    await payOnPage(body.url, '600.00');
    const payment = (await invoiceOf(invoice.id)).payments[0];
    await grower.post(`/api/payments/${payment.id}/refunds`, { amountCents: 100 }).expect(403);
    const tooMuch = await keeper.post(`/api/payments/${payment.id}/refunds`, { amountCents: 60_001 }).expect(400);
    // Said in money, as the form takes it, not in cents.
    expect(tooMuch.body.error.fields).toEqual({ amountCents: 'must be at most $600.00' });
    expect(tooMuch.body.error.message).toBe('At most $600.00 of this payment can be refunded.');
    await keeper.post(`/api/payments/${payment.id}/refunds`, { amountCents: 6_000, reason: 'One colony under strength' }).expect(202);
    const refunded = await eventually(async () => {
      const inv = await invoiceOf(invoice.id);
      return inv.paidCents === 54_000 ? inv : null;
    });
    // $600.00 paid - $60.00 refunded = $540.00 paid; $60.00 outstanding again.
    expect(refunded.outstandingCents).toBe(6_000);
    expect(refunded.status).not.toBe('paid');
    expect(refunded.refunds).toEqual([expect.objectContaining({ state: 'succeeded', amountCents: 6_000, reason: 'One colony under strength' })]);
    const refundEvent = t.payments.events.find((e) => e.type === 'refund.created' && e.data.object.payment_intent === t.payments.events.find((x) => x.type === 'payment_intent.succeeded' && (x.data.object.metadata as Record<string, string>).invoice_id === invoice.id)!.data.object.id)!;
    expect(await t.payments.redeliver(refundEvent)).toBe(200);
    expect((await invoiceOf(invoice.id)).paidCents).toBe(54_000);
  });

  it('records cheques and bank transfers from the beekeeper, within what is outstanding', async () => {
    const invoice = await issuedInvoice();
    await grower.post('/api/payments', { invoiceId: invoice.id, method: 'cheque', amountCents: 100, receivedOn: '2026-01-05' }).expect(403);
    const bad = await keeper.post('/api/payments', { invoiceId: invoice.id, method: 'barter', amountCents: 0, receivedOn: '5 Jan' }).expect(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['method', 'amountCents', 'receivedOn']));
    const over = await keeper.post('/api/payments', { invoiceId: invoice.id, method: 'cheque', amountCents: 60_001, receivedOn: todayThere }).expect(400);
    expect(over.body.error.fields).toHaveProperty('amountCents');
    const future = await keeper.post('/api/payments', { invoiceId: invoice.id, method: 'cheque', amountCents: 100, receivedOn: '2099-01-01' }).expect(400);
    expect(future.body.error.fields).toHaveProperty('receivedOn');
    const recorded = await keeper.post('/api/payments', { invoiceId: invoice.id, method: 'bank-transfer', amountCents: 30_000, receivedOn: todayThere, reference: 'TRF 7781' }).expect(201);
    expect(recorded.body.invoice.paidCents).toBe(30_000);
    expect(recorded.body.invoice.status).toBe('partly-paid');
    const other = await buildOrganization({ kind: 'apiary' });
    await buildUser({ organization: other, role: 'owner', email: 'owner@elsewhere-bees.test' });
    const stranger = await signedInClient(t.app, 'owner@elsewhere-bees.test');
    await stranger.post('/api/payments', { invoiceId: invoice.id, method: 'cheque', amountCents: 100, receivedOn: todayThere }).expect(404);
    await keeper.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(403);
  });
});
