import Stripe from 'stripe';
import { startPaymentsStandIn } from '../server/src/fakes/payments-stand-in.ts';
const s = await startPaymentsStandIn({ secretKey: 'sk_test_x', webhookSecret: 'whsec_x' });
const stripe = new Stripe('sk_test_x', { host: '127.0.0.1', port: s.port, protocol: 'http', maxNetworkRetries: 0 });
const cs = await stripe.checkout.sessions.create({ mode: 'payment', line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: 1234, product_data: { name: 'Invoice 1' } } }], success_url: 'http://127.0.0.1/x', cancel_url: 'http://127.0.0.1/y', metadata: { invoice_id: 'abc' }, payment_intent_data: { metadata: { invoice_id: 'abc' } } });
console.log(cs.id, cs.url, cs.amount_total, cs.metadata);
const r = await fetch(cs.url!, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: 'amount=5.00&outcome=pay', redirect: 'manual' });
console.log(r.status, r.headers.get('location'));
const pi = [...s.paymentIntents.values()][0];
const ref = await stripe.refunds.create({ payment_intent: pi.id, amount: 200 });
console.log(ref.id, ref.amount, ref.status);
const ev = s.events[0];
const payload = JSON.stringify(ev);
const h = stripe.webhooks.generateTestHeaderString({ payload, secret: 'whsec_x' });
console.log(stripe.webhooks.constructEvent(payload, h, 'whsec_x').type);
try { await stripe.refunds.create({ payment_intent: pi.id, amount: 9999 }); } catch (e: any) { console.log('err', e.type, e.message, e.statusCode); }
await s.stop();
