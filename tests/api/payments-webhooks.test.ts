// The payments service's webhooks under the conditions its own guide warns of, and the
// two-tabs double payment: the same signed event delivered five times, events out of
// order, a forged signature, a payment for more than is owed, and two checkouts opened
// for one invoice.
//
// What the hosted service promises (Stripe Docs, "Receive Stripe events in your webhook
// endpoint", 2025, from memory): an endpoint may receive the same event more than once,
// events are not guaranteed to arrive in the order they were created, and the
// Stripe-Signature header must be verified before an event is trusted. Checkout sessions
// can be expired while open ("Expire a Checkout Session", same docs), after which they
// cannot be paid.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import Stripe from 'stripe';
import { DateTime } from 'luxon';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import type { Organization } from '../../server/src/db/models/organization.model.js';
import { buildBillableSeason, buildBillingParties, buildInvoice } from '../support/builders/invoices.js';

describe('payment webhooks and online checkout', () => {
  let t: TestApp;
  let keeper: ApiClient;
  let grower: ApiClient;
  let farm: Organization;
  let apiary: Organization;
  const clock = new Date();
  const todayThere = DateTime.fromJSDate(clock, { zone: 'America/Los_Angeles' }).toISODate()!;

  beforeAll(async () => {
    t = await startTestApp({ now: () => clock });
    ({ farm, apiary } = await buildBillingParties({ farm: 'Hollowfield Orchard', apiary: 'Quillwort Bees', farmOwnerEmail: 'owner@hollowfield.test', apiaryOwnerEmail: 'owner@quillwort.test' }));
    keeper = await signedInClient(t.app, 'owner@quillwort.test');
    grower = await signedInClient(t.app, 'owner@hollowfield.test');
  });
  afterAll(async () => { await t?.stop(); });

  /** An issued invoice of 10 colonies x $60.00 = $600.00 (no tax). */
  async function issuedInvoice() {
    const season = await buildBillableSeason({ farm, apiary, colonies: 10, deliveredAt: clock, pricePerColonyCents: 6000, lon: -119.9 + Math.random() });
    return buildInvoice({ agreement: season.agreement, apiary, issuedAt: clock });
  }

  const invoiceAs = async (client: ApiClient, id: string) => (await client.get(`/api/invoices/${id}`).expect(200)).body.invoice;
  const intentFor = (invoiceId: string, id: string, cents: number) => ({
    id, object: 'payment_intent', amount: cents, amount_received: cents, currency: 'usd', status: 'succeeded', metadata: { invoice_id: invoiceId },
  });
  const processedEvents = (eventId: string) => t.context.models.ProcessedWebhookEvent.count({ where: { eventId } });
  const payOnPage = (url: string, amount: string) =>
    fetch(url, { method: 'POST', headers: { 'Content-Type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ amount, outcome: 'pay' }), redirect: 'manual' });
  const sessionOf = (url: string) => t.payments.sessions.get(url.split('/').pop()!)!;

  it('records one payment when the same signed event is delivered five times', async () => {
    const invoice = await issuedInvoice();
    const { event, status } = await t.payments.sendEvent('payment_intent.succeeded', intentFor(invoice.id, 'pi_test_five_times', 60_000));
    expect(status).toBe(200);
    // Three more at the same moment, then a fifth later: each answered 200, none counted again.
    expect(await Promise.all([t.payments.redeliver(event), t.payments.redeliver(event), t.payments.redeliver(event)])).toEqual([200, 200, 200]);
    expect(await t.payments.redeliver(event)).toBe(200);
    const after = await invoiceAs(grower, invoice.id);
    expect(after.payments).toHaveLength(1);
    // $600.00 paid once: nothing outstanding, nothing beyond.
    expect(after.paidCents).toBe(60_000);
    expect(after.outstandingCents).toBe(0);
    expect(after.overpaidCents).toBe(0);
    expect(after.status).toBe('paid');
    expect(await processedEvents(event.id)).toBe(1);
  });

  it('applies events arriving out of order without a late one moving a state back', async () => {
    const invoice = await issuedInvoice();
    const refund = { id: 're_test_out_of_order', object: 'refund', amount: 10_000, status: 'succeeded', payment_intent: 'pi_test_order_a', metadata: { invoice_id: invoice.id } };
    // The refund's event comes before its payment's: kept, not yet counted.
    expect((await t.payments.sendEvent('refund.created', refund)).status).toBe(200);
    expect((await invoiceAs(grower, invoice.id)).paidCents).toBe(0);
    // A declined card on a second attempt, then the first payment's success.
    const declined = { ...intentFor(invoice.id, 'pi_test_order_b', 60_000), amount_received: 0, status: 'requires_payment_method', last_payment_error: { message: 'Your card was declined (test).' } };
    expect((await t.payments.sendEvent('payment_intent.payment_failed', declined)).status).toBe(200);
    expect((await t.payments.sendEvent('payment_intent.succeeded', intentFor(invoice.id, 'pi_test_order_a', 30_000))).status).toBe(200);
    // Late reports: the first payment "failed", the refund "pending". Neither undoes anything.
    await t.payments.sendEvent('payment_intent.payment_failed', { ...intentFor(invoice.id, 'pi_test_order_a', 30_000), status: 'requires_payment_method', last_payment_error: { message: 'late' } });
    await t.payments.sendEvent('refund.updated', { ...refund, status: 'pending' });
    const after = await invoiceAs(keeper, invoice.id);
    // $300.00 received - $100.00 refunded = $200.00 paid; $600.00 - $200.00 = $400.00 outstanding.
    expect(after.paidCents).toBe(20_000);
    expect(after.outstandingCents).toBe(40_000);
    expect(after.status).toBe('partly-paid');
    expect(after.payments.map((p: { state: string; amountCents: number }) => [p.state, p.amountCents]).sort()).toEqual([['failed', 60_000], ['succeeded', 30_000]]);
    expect(after.refunds).toEqual([expect.objectContaining({ state: 'succeeded', amountCents: 10_000 })]);
  });

  it('rejects a forged signature with a 400 and changes nothing', async () => {
    const invoice = await issuedInvoice();
    const event = {
      id: 'evt_test_forged_webhook', object: 'event', type: 'payment_intent.succeeded', created: Math.floor(Date.now() / 1000),
      data: { object: intentFor(invoice.id, 'pi_test_forged_webhook', 60_000) },
    };
    const payload = JSON.stringify(event);
    const forger = new Stripe('sk_test_forger');
    const post = (body: string, signature: string) =>
      fetch(`${t.baseUrl}/api/webhooks/payments`, { method: 'POST', headers: { 'Content-Type': 'application/json', 'Stripe-Signature': signature }, body });
    const forged = await post(payload, forger.webhooks.generateTestHeaderString({ payload, secret: 'whsec_guessed' }));
    expect(forged.status).toBe(400);
    expect((await forged.json()).error.message).toMatch(/signature/);
    // A real signature over another body does not carry over to this one.
    const other = JSON.stringify({ ...event, id: 'evt_test_other' });
    expect((await post(payload, forger.webhooks.generateTestHeaderString({ payload: other, secret: t.config.payments.webhookSecret }))).status).toBe(400);
    const after = await invoiceAs(grower, invoice.id);
    expect(after.payments).toEqual([]);
    expect(after.paidCents).toBe(0);
    expect(await processedEvents(event.id)).toBe(0);
  });

  it('records a payment for more than is owed as an overpayment, tells both sides and lets the beekeeper refund the excess', async () => {
    const invoice = await issuedInvoice();
    // The grower opens a checkout for the whole $600.00; a $200.00 cheque is recorded before the card step.
    const { url } = (await grower.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(201)).body;
    await keeper.post('/api/payments', { invoiceId: invoice.id, method: 'cheque', amountCents: 20_000, receivedOn: todayThere, reference: 'Cheque 2231' }).expect(201);
    const before = t.sink.messages.length;
    expect((await payOnPage(url, '600.00')).status).toBe(303);

    // $600.00 arrived when $600.00 - $200.00 = $400.00 was owed: $200.00 beyond the balance.
    for (const client of [grower, keeper]) {
      const seen = await invoiceAs(client, invoice.id);
      expect(seen.paidCents).toBe(80_000);
      expect(seen.outstandingCents).toBe(0);
      expect(seen.overpaidCents).toBe(20_000);
      expect(seen.status).toBe('paid');
      expect(seen.payments.find((p: { method: string }) => p.method === 'online')).toMatchObject({ amountCents: 60_000, overpaidCents: 20_000 });
    }
    const notices = await eventually(() => {
      const found = t.sink.messages.slice(before).filter((m) => m.subject.startsWith(`Overpayment on invoice INV-${String(invoice.number).padStart(5, '0')}`));
      return found.length >= 2 ? found : null;
    });
    expect(notices.flatMap((m) => m.to).sort()).toEqual(['owner@hollowfield.test', 'owner@quillwort.test']);
    expect(notices[0].text).toContain('$200.00');

    // The beekeeper refunds the excess through the usual refund of the online payment.
    const online = (await invoiceAs(keeper, invoice.id)).payments.find((p: { method: string }) => p.method === 'online');
    await keeper.post(`/api/payments/${online.id}/refunds`, { amountCents: 20_000, reason: 'Paid twice' }).expect(202);
    const settled = await eventually(async () => {
      const inv = await invoiceAs(grower, invoice.id);
      return inv.overpaidCents === 0 ? inv : null;
    });
    // $800.00 received - $200.00 refunded = $600.00, exactly the invoice.
    expect(settled.paidCents).toBe(60_000);
    expect(settled.outstandingCents).toBe(0);
    expect(settled.status).toBe('paid');
  });

  it('lets only the newest checkout of an invoice be paid (two tabs), so the balance is paid once', async () => {
    const invoice = await issuedInvoice();
    const first = (await grower.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(201)).body.url;
    const second = (await grower.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(201)).body.url;
    expect(sessionOf(first).status).toBe('expired');
    expect(sessionOf(second).status).toBe('open');
    const stale = await payOnPage(first, '600.00');
    expect(stale.status).toBe(410);
    expect(await stale.text()).toContain('expired');
    expect((await payOnPage(second, '600.00')).status).toBe(303);
    const after = await invoiceAs(grower, invoice.id);
    expect(after.payments).toHaveLength(1);
    expect(after.paidCents).toBe(60_000);
    expect(after.outstandingCents).toBe(0);
    expect(after.overpaidCents).toBe(0);
    await grower.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(409);
  });

  it('leaves one checkout open when two are opened at the same moment', async () => {
    const invoice = await issuedInvoice();
    const answers = await Promise.all([0, 1].map(() => grower.post('/api/payments/checkout', { invoiceId: invoice.id })));
    expect(answers.map((a) => a.status)).toEqual([201, 201]);
    const open = [...t.payments.sessions.values()].filter((s) => s.client_reference_id === invoice.id && s.status === 'open');
    expect(open).toHaveLength(1);
  });

  it('refuses a new checkout while the payment of an earlier one is still being confirmed', async () => {
    const invoice = await issuedInvoice();
    const first = (await grower.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(201)).body.url;
    const webhookUrl = `${t.baseUrl}/api/webhooks/payments`;
    t.payments.setWebhookUrl(''); // the service's event is delayed
    try {
      expect((await payOnPage(first, '600.00')).status).toBe(303);
    } finally {
      t.payments.setWebhookUrl(webhookUrl);
    }
    const refused = await grower.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(409);
    expect(refused.body.error.message).toMatch(/being confirmed/);
    const late = t.payments.events.find((e) => e.type === 'payment_intent.succeeded' && (e.data.object.metadata as Record<string, string>).invoice_id === invoice.id)!;
    expect(await t.payments.redeliver(late)).toBe(200);
    const after = await invoiceAs(grower, invoice.id);
    expect(after.paidCents).toBe(60_000);
    expect(after.status).toBe('paid');
    await grower.post('/api/payments/checkout', { invoiceId: invoice.id }).expect(409);
  });
});
