// Local stand-in for the hosted payments service, spoken to by the official `stripe` SDK
// (host 127.0.0.1, http). It implements only what Pollenpact calls, with the same
// form-encoded requests and JSON answers: POST/GET /v1/checkout/sessions, POST
// /v1/checkout/sessions/:id/expire, GET /v1/payment_intents/:id and POST /v1/refunds. It serves the card step itself (a page
// clearly marked TEST PAYMENT where a full or partial amount can be paid, or the card
// declined) and sends signed webhook events back, the way the hosted service does.
import express, { type Request, type Response } from 'express';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { randomBytes } from 'node:crypto';
import Stripe from 'stripe';

export interface StandInEvent {
  id: string;
  object: 'event';
  type: string;
  created: number;
  api_version: string;
  livemode: false;
  pending_webhooks: number;
  request: { id: null; idempotency_key: null };
  data: { object: Record<string, unknown> };
}

export interface PaymentsStandIn {
  port: number;
  url: string;
  /** Where signed events are POSTed (the app's /api/webhooks/payments). */
  setWebhookUrl(url: string): void;
  sessions: Map<string, CheckoutSession>;
  paymentIntents: Map<string, PaymentIntent>;
  events: StandInEvent[];
  /** Builds, signs and delivers an event; resolves with it and the app's HTTP status. */
  sendEvent(type: string, object: Record<string, unknown>): Promise<{ event: StandInEvent; status: number }>;
  /** Delivers an already-sent event again (a duplicate delivery), freshly signed. */
  redeliver(event: StandInEvent): Promise<number>;
  stop(): Promise<void>;
}

interface CheckoutSession {
  id: string;
  object: 'checkout.session';
  mode: string;
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  amount_total: number;
  currency: string;
  client_reference_id: string | null;
  metadata: Record<string, string>;
  payment_intent: string | null;
  success_url: string;
  cancel_url: string;
  url: string;
  created: number;
  /** Not in the hosted API: what the payment intents copy (payment_intent_data.metadata). */
  intentMetadata: Record<string, string>;
  description: string;
}

interface PaymentIntent {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  currency: string;
  status: 'succeeded' | 'requires_payment_method';
  metadata: Record<string, string>;
  last_payment_error: { code: string; message: string } | null;
  created: number;
  refunded: number;
}

const apiVersion = '2025-01-27';
const randomId = (prefix: string) => `${prefix}_test_${randomBytes(12).toString('hex')}`;
const nowSeconds = () => Math.floor(Date.now() / 1000);

function stripeError(res: Response, status: number, message: string, param?: string) {
  res.status(status).json({ error: { type: 'invalid_request_error', message, ...(param ? { param } : {}) } });
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export async function startPaymentsStandIn(options: { port?: number; secretKey: string; webhookSecret: string; webhookUrl?: string }): Promise<PaymentsStandIn> {
  const signer = new Stripe(options.secretKey);
  const sessions = new Map<string, CheckoutSession>();
  const paymentIntents = new Map<string, PaymentIntent>();
  const events: StandInEvent[] = [];
  let webhookUrl = options.webhookUrl ?? null;

  async function deliver(event: StandInEvent): Promise<number> {
    if (!webhookUrl) return 0;
    const payload = JSON.stringify(event);
    const header = signer.webhooks.generateTestHeaderString({ payload, secret: options.webhookSecret });
    try {
      const res = await fetch(webhookUrl, { method: 'POST', headers: { 'Content-Type': 'application/json', 'Stripe-Signature': header }, body: payload });
      return res.status;
    } catch {
      return 0;
    }
  }

  async function sendEvent(type: string, object: Record<string, unknown>) {
    const event: StandInEvent = {
      id: randomId('evt'), object: 'event', type, created: nowSeconds(), api_version: apiVersion, livemode: false, pending_webhooks: 1,
      request: { id: null, idempotency_key: null }, data: { object },
    };
    events.push(event);
    return { event, status: await deliver(event) };
  }

  const app = express();
  app.disable('x-powered-by');
  const api = express.Router();
  api.use(express.urlencoded({ extended: true }));
  api.use((req, res, next) => {
    const auth = req.get('authorization') ?? '';
    if (auth !== `Bearer ${options.secretKey}`) return stripeError(res, 401, 'Invalid API Key provided.');
    next();
  });

  api.post('/checkout/sessions', (req: Request, res: Response) => {
    const body = req.body as Record<string, any>;
    if (body.mode !== 'payment') return stripeError(res, 400, 'Only mode=payment is supported here.', 'mode');
    const items = Array.isArray(body.line_items) ? body.line_items : [];
    if (items.length === 0) return stripeError(res, 400, 'Missing required param: line_items.', 'line_items');
    let amount = 0;
    let currency = '';
    for (const item of items) {
      const unit = Number(item?.price_data?.unit_amount);
      const quantity = Number(item?.quantity ?? 1);
      if (!Number.isInteger(unit) || unit <= 0 || !Number.isInteger(quantity) || quantity <= 0) return stripeError(res, 400, 'Invalid line item amount.', 'line_items');
      amount += unit * quantity;
      currency = String(item.price_data.currency ?? '').toLowerCase();
    }
    if (!body.success_url) return stripeError(res, 400, 'Missing required param: success_url.', 'success_url');
    const id = randomId('cs');
    const session: CheckoutSession = {
      id, object: 'checkout.session', mode: 'payment', status: 'open', payment_status: 'unpaid', amount_total: amount, currency,
      client_reference_id: body.client_reference_id ?? null, metadata: body.metadata ?? {}, payment_intent: null,
      success_url: String(body.success_url), cancel_url: String(body.cancel_url ?? body.success_url),
      url: `http://127.0.0.1:${port}/pay/${id}`, created: nowSeconds(),
      intentMetadata: body.payment_intent_data?.metadata ?? body.metadata ?? {},
      description: String(items[0]?.price_data?.product_data?.name ?? 'Payment'),
    };
    sessions.set(id, session);
    res.json(publicSession(session));
  });

  api.get('/checkout/sessions/:id', (req, res) => {
    const session = sessions.get(req.params.id);
    if (!session) return stripeError(res, 404, `No such checkout.session: '${req.params.id}'`, 'id');
    res.json(publicSession(session));
  });

  // Expiring an open session: its page can no longer be paid; the service reports it by webhook.
  api.post('/checkout/sessions/:id/expire', (req, res) => {
    const session = sessions.get(req.params.id);
    if (!session) return stripeError(res, 404, `No such checkout.session: '${req.params.id}'`, 'id');
    if (session.status !== 'open') return stripeError(res, 400, `Only Checkout Sessions with a status of 'open' can be expired; this one is '${session.status}'.`);
    session.status = 'expired';
    res.json(publicSession(session));
    setImmediate(() => void sendEvent('checkout.session.expired', publicSession(session)));
  });

  api.get('/payment_intents/:id', (req, res) => {
    const intent = paymentIntents.get(req.params.id);
    if (!intent) return stripeError(res, 404, `No such payment_intent: '${req.params.id}'`, 'id');
    res.json(intent);
  });

  api.post('/refunds', (req, res) => {
    const body = req.body as Record<string, any>;
    const intent = paymentIntents.get(String(body.payment_intent ?? ''));
    if (!intent || intent.status !== 'succeeded') return stripeError(res, 400, 'No succeeded payment_intent to refund.', 'payment_intent');
    const left = intent.amount_received - intent.refunded;
    const amount = body.amount === undefined ? left : Number(body.amount);
    if (!Number.isInteger(amount) || amount <= 0 || amount > left) return stripeError(res, 400, `Refund amount must be between 1 and ${left}.`, 'amount');
    intent.refunded += amount;
    const refund = {
      id: randomId('re'), object: 'refund', amount, currency: intent.currency, payment_intent: intent.id, status: 'succeeded',
      reason: body.reason ?? null, metadata: { ...intent.metadata, ...(body.metadata ?? {}) }, created: nowSeconds(),
    };
    res.json(refund);
    // The hosted service reports the refund by webhook shortly after answering.
    setImmediate(() => void sendEvent('refund.created', refund));
  });

  app.use('/v1', api);

  app.get('/favicon.ico', (_req, res) => res.status(204).end());

  // The card step: a page of our own, clearly a test.
  app.get('/pay/:id', (req, res) => {
    const session = sessions.get(req.params.id);
    if (!session) return res.status(404).type('text/plain').send('No such payment session.');
    if (session.status === 'expired') return res.status(410).type('html').send(payPage(session, 'This payment page has expired; nothing was charged. Go back to the invoice to pay.'));
    res.type('html').send(payPage(session));
  });

  app.post('/pay/:id', express.urlencoded({ extended: false }), async (req, res) => {
    const session = sessions.get(req.params.id);
    if (!session) return res.status(404).type('text/plain').send('No such payment session.');
    if (session.status === 'complete') return res.redirect(303, session.success_url);
    if (session.status === 'expired') return res.status(410).type('html').send(payPage(session, 'This payment page has expired; nothing was charged. Go back to the invoice to pay.'));
    const amount = Math.round(Number(String(req.body.amount ?? '').replace(/,/g, '')) * 100);
    if (!Number.isInteger(amount) || amount <= 0 || amount > session.amount_total) {
      return res.status(400).type('html').send(payPage(session, `Enter an amount between 0.01 and ${(session.amount_total / 100).toFixed(2)}.`));
    }
    const declined = req.body.outcome === 'decline';
    const intent: PaymentIntent = {
      id: randomId('pi'), object: 'payment_intent', amount, amount_received: declined ? 0 : amount, currency: session.currency,
      status: declined ? 'requires_payment_method' : 'succeeded', metadata: session.intentMetadata,
      last_payment_error: declined ? { code: 'card_declined', message: 'Your card was declined (test).' } : null, created: nowSeconds(), refunded: 0,
    };
    paymentIntents.set(intent.id, intent);
    if (declined) {
      await sendEvent('payment_intent.payment_failed', { ...intent });
      return res.status(402).type('html').send(payPage(session, 'The card was declined (test). Nothing was charged.'));
    }
    session.status = 'complete';
    session.payment_status = 'paid';
    session.payment_intent = intent.id;
    await sendEvent('payment_intent.succeeded', { ...intent });
    res.redirect(303, session.success_url);
  });

  const server: Server = createServer(app);
  await new Promise<void>((r) => server.listen(options.port ?? 0, '127.0.0.1', r));
  const port = (server.address() as AddressInfo).port;

  return {
    port,
    url: `http://127.0.0.1:${port}`,
    setWebhookUrl(url) {
      webhookUrl = url;
    },
    sessions,
    paymentIntents,
    events,
    sendEvent,
    redeliver: deliver,
    async stop() {
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
    },
  };
}

function publicSession(session: CheckoutSession) {
  const { intentMetadata: _m, description: _d, ...rest } = session;
  return rest;
}

function payPage(session: CheckoutSession, message?: string) {
  const amount = (session.amount_total / 100).toFixed(2);
  const currency = session.currency.toUpperCase();
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>TEST PAYMENT</title>
<style>
  body { font-family: system-ui, sans-serif; margin: 0; background: #f6f4ee; color: #1d2a22; }
  .banner { background: #b3261e; color: #fff; font-weight: 700; letter-spacing: .08em; text-align: center; padding: .75rem; }
  main { max-width: 26rem; margin: 2rem auto; background: #fff; padding: 1.5rem; border-radius: .5rem; box-shadow: 0 1px 4px #0002; }
  label { display: block; margin: 1rem 0 .25rem; font-weight: 600; }
  input { font: inherit; padding: .5rem; width: 100%; box-sizing: border-box; }
  .actions { display: flex; gap: .75rem; margin-top: 1.25rem; flex-wrap: wrap; }
  button { font: inherit; padding: .6rem 1rem; border-radius: .35rem; border: 1px solid #1d2a22; cursor: pointer; }
  .pay { background: #1d5c3a; color: #fff; border-color: #1d5c3a; }
  .message { color: #b3261e; font-weight: 600; }
</style></head>
<body>
  <div class="banner" role="banner">TEST PAYMENT — no real card is charged</div>
  <main>
    <h1>Test payment</h1>
    <p>${escapeHtml(session.description)}</p>
    <p>Amount due: <strong>${currency} ${amount}</strong></p>
    ${message ? `<p class="message" role="alert">${escapeHtml(message)}</p>` : ''}
    ${session.status === 'expired' ? '' : `<form method="post" action="/pay/${escapeHtml(session.id)}">
      <label for="amount">Amount to pay (${currency})</label>
      <input id="amount" name="amount" inputmode="decimal" value="${amount}" required>
      <div class="actions">
        <button class="pay" type="submit" name="outcome" value="pay">Pay (test)</button>
        <button type="submit" name="outcome" value="decline">Decline the card (test)</button>
      </div>
    </form>`}
    <p><a href="${escapeHtml(session.cancel_url)}">Back without paying</a></p>
  </main>
</body></html>`;
}
