// Verified events from the payments service are the only thing that changes an online
// payment. Idempotent: each event id is processed once (recorded in the same transaction
// as its effect), a payment is keyed by the service's payment id so two events about the
// same payment never count it twice, and states only move forward (a late "failed" never
// undoes a success; a refund counts only once its payment has succeeded).
import type { Request, Response } from 'express';
import { QueryTypes, type Transaction } from 'sequelize';
import type Stripe from 'stripe';
import type { AppContext } from '../../context.js';
import { paymentsClient } from './payments-client.js';
import { publishInvoiceChange } from '../invoices/invoice-events.js';

type Outcome = 'processed' | 'duplicate' | 'ignored';

interface IntentObject { id: string; amount: number; amount_received: number; currency: string; metadata?: Record<string, string> | null; last_payment_error?: { message?: string } | null }
interface RefundObject { id: string; amount: number; status: string | null; payment_intent: string | null; metadata?: Record<string, string> | null }

async function invoiceExists(ctx: AppContext, id: string | undefined, transaction: Transaction): Promise<string | null> {
  if (!id || !/^[0-9a-f-]{36}$/i.test(id)) return null;
  const [row] = await ctx.sequelize.query<{ id: string }>("SELECT id FROM invoices WHERE id = :id AND lifecycle <> 'draft'", { replacements: { id }, type: QueryTypes.SELECT, transaction });
  return row?.id ?? null;
}

async function applyIntent(ctx: AppContext, intent: IntentObject, succeeded: boolean, transaction: Transaction): Promise<string | null> {
  const invoiceId = await invoiceExists(ctx, intent.metadata?.invoice_id, transaction);
  if (!invoiceId) return null;
  const replacements = {
    invoiceId, providerId: intent.id, currency: intent.currency.toUpperCase(), now: ctx.now().toISOString(),
    amount: succeeded ? intent.amount_received : intent.amount, failure: succeeded ? null : intent.last_payment_error?.message ?? 'The payment failed.',
  };
  const sql = succeeded
    ? `INSERT INTO payments (invoice_id, method, state, amount_cents, currency, provider_payment_id, received_at)
       VALUES (:invoiceId, 'online', 'succeeded', :amount, :currency, :providerId, :now)
       ON CONFLICT (provider_payment_id) DO UPDATE SET state = 'succeeded', amount_cents = EXCLUDED.amount_cents, failure_message = NULL,
         received_at = EXCLUDED.received_at, updated_at = now()
       WHERE payments.state <> 'succeeded'`
    : `INSERT INTO payments (invoice_id, method, state, amount_cents, currency, provider_payment_id, failure_message)
       VALUES (:invoiceId, 'online', 'failed', :amount, :currency, :providerId, :failure)
       ON CONFLICT (provider_payment_id) DO UPDATE SET state = 'failed', failure_message = EXCLUDED.failure_message, updated_at = now()
       WHERE payments.state = 'pending'`;
  if (replacements.amount <= 0) return null;
  await ctx.sequelize.query(sql, { replacements, transaction });
  return invoiceId;
}

async function applyRefund(ctx: AppContext, refund: RefundObject, transaction: Transaction): Promise<string | null> {
  if (!refund.payment_intent) return null;
  let invoiceId = await invoiceExists(ctx, refund.metadata?.invoice_id, transaction);
  if (!invoiceId) {
    const [payment] = await ctx.sequelize.query<{ invoice_id: string }>('SELECT invoice_id FROM payments WHERE provider_payment_id = :pi', {
      replacements: { pi: refund.payment_intent }, type: QueryTypes.SELECT, transaction,
    });
    invoiceId = payment?.invoice_id ?? null;
  }
  if (!invoiceId) return null;
  const state = refund.status === 'succeeded' ? 'succeeded' : refund.status === 'failed' || refund.status === 'canceled' ? 'failed' : 'pending';
  await ctx.sequelize.query(
    `INSERT INTO refunds (invoice_id, provider_refund_id, provider_payment_id, state, amount_cents)
     VALUES (:invoiceId, :refundId, :pi, :state, :amount)
     ON CONFLICT (provider_refund_id) DO UPDATE SET state = EXCLUDED.state, updated_at = now()
     WHERE refunds.state = 'pending' OR (refunds.state = 'succeeded' AND EXCLUDED.state = 'failed')`,
    { replacements: { invoiceId, refundId: refund.id, pi: refund.payment_intent, state, amount: refund.amount }, transaction },
  );
  return invoiceId;
}

export async function handlePaymentEvent(ctx: AppContext, event: Stripe.Event): Promise<Outcome> {
  let changedInvoice: string | null = null;
  const outcome = await ctx.sequelize.transaction(async (transaction): Promise<Outcome> => {
    const inserted = await ctx.sequelize.query<{ event_id: string }>(
      'INSERT INTO processed_webhook_events (event_id, type) VALUES (:id, :type) ON CONFLICT DO NOTHING RETURNING event_id',
      { replacements: { id: event.id, type: event.type }, type: QueryTypes.SELECT, transaction },
    );
    if (inserted.length === 0) return 'duplicate';
    const object = event.data.object as unknown;
    switch (event.type) {
      case 'payment_intent.succeeded':
        changedInvoice = await applyIntent(ctx, object as IntentObject, true, transaction);
        break;
      case 'payment_intent.payment_failed':
        changedInvoice = await applyIntent(ctx, object as IntentObject, false, transaction);
        break;
      case 'refund.created':
      case 'refund.updated':
      case 'refund.failed':
        changedInvoice = await applyRefund(ctx, object as RefundObject, transaction);
        break;
      default:
        return 'ignored';
    }
    return changedInvoice ? 'processed' : 'ignored';
  });
  if (changedInvoice) await publishInvoiceChange(ctx, changedInvoice);
  return outcome;
}

/** POST /api/webhooks/payments: raw body, signature checked by the SDK; 400 and nothing changes when it does not verify. */
export function paymentsWebhookHandler(ctx: AppContext) {
  return async (req: Request, res: Response) => {
    const signature = req.get('stripe-signature');
    let event: Stripe.Event;
    try {
      if (!signature || !Buffer.isBuffer(req.body)) throw new Error('missing signature or body');
      event = paymentsClient(ctx.config).webhooks.constructEvent(req.body, signature, ctx.config.payments.webhookSecret);
    } catch {
      res.status(400).json({ error: { code: 'bad_request', message: 'The webhook signature does not verify.' } });
      return;
    }
    const outcome = await handlePaymentEvent(ctx, event);
    res.json({ received: true, outcome });
  };
}
