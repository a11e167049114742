// Verified events from the payments service are the only thing that changes an online
// payment. Idempotent: each event id is processed once (recorded in the same transaction
// as its effect), a payment is keyed by the service's payment id so two events about the
// same payment never count it twice, and states only move forward (a late "failed" never
// undoes a success; a refund counts only once its payment has succeeded). Every effect
// runs under the invoice's row lock, so events about one invoice queue, and a payment
// arriving when less is owed than it brings is recorded with its overpayment.
import { Op, type Transaction } from 'sequelize';
import type Stripe from 'stripe';
import type { AppContext } from '../../context.js';
import type { Invoice } from '../../db/models/invoice.model.js';
import { publishInvoiceChange } from '../invoices/invoice-events.js';
import { selectInvoiceById } from '../invoices/invoices.queries.js';
import { owedCents } from '../invoices/invoice-summary.js';
import { sendOverpaymentNotice } from './overpayment-notice.js';

type Outcome = 'processed' | 'duplicate' | 'ignored';

interface IntentObject { id: string; amount: number; amount_received: number; currency: string; metadata?: Record<string, string> | null; last_payment_error?: { message?: string } | null }
interface RefundObject { id: string; amount: number; status: string | null; payment_intent: string | null; metadata?: Record<string, string> | null }

/** What an event changed: the invoice, and a payment that went beyond what was owed. */
interface Effect { invoiceId: string; overpaymentId?: string }

const isUuid = (id: string | undefined): id is string => !!id && /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id);

export function createPaymentEventsService(ctx: AppContext) {
  const { Invoice, Payment, Refund, ProcessedWebhookEvent } = ctx.models;

  /** The issued (or void) invoice, locked for the rest of the transaction. */
  function lockInvoice(id: string | undefined, transaction: Transaction): Promise<Invoice | null> {
    if (!isUuid(id)) return Promise.resolve(null);
    return Invoice.findOne({ where: { id, lifecycle: { [Op.ne]: 'draft' } }, attributes: ['id'], lock: transaction.LOCK.UPDATE, transaction });
  }

  async function applyIntent(intent: IntentObject, succeeded: boolean, transaction: Transaction): Promise<Effect | null> {
    const invoice = await lockInvoice(intent.metadata?.invoice_id, transaction);
    const amount = succeeded ? intent.amount_received : intent.amount;
    if (!invoice || !(amount > 0)) return null;
    const effect: Effect = { invoiceId: invoice.id };
    const known = await Payment.findOne({ where: { providerPaymentId: intent.id }, lock: transaction.LOCK.UPDATE, transaction });
    if (!succeeded) {
      const failure = { state: 'failed' as const, failureMessage: intent.last_payment_error?.message ?? 'The payment failed.' };
      if (!known) {
        await Payment.create({
          invoiceId: invoice.id, method: 'online', amountCents: amount, currency: intent.currency.toUpperCase(), providerPaymentId: intent.id,
          reference: null, receivedAt: null, recordedBy: null, ...failure,
        }, { transaction });
      } else if (known.state === 'pending') {
        await known.update(failure, { transaction });
      }
      return effect;
    }
    if (known?.state === 'succeeded') return effect;
    // What was owed before this payment counts (it is not succeeded yet, so not in paid_cents).
    const row = await selectInvoiceById(ctx.sequelize, invoice.id, transaction);
    const overpaidCents = Math.max(0, amount - (row ? owedCents(row) : 0));
    const success = { state: 'succeeded' as const, amountCents: amount, failureMessage: null, receivedAt: ctx.now(), overpaidCents };
    const payment = known
      ? await known.update(success, { transaction })
      : await Payment.create({
        invoiceId: invoice.id, method: 'online', currency: intent.currency.toUpperCase(), providerPaymentId: intent.id, reference: null, recordedBy: null, ...success,
      }, { transaction });
    if (overpaidCents > 0) effect.overpaymentId = payment.id;
    return effect;
  }

  async function applyRefund(refund: RefundObject, transaction: Transaction): Promise<Effect | null> {
    if (!refund.payment_intent) return null;
    let invoiceId = refund.metadata?.invoice_id;
    if (!isUuid(invoiceId)) {
      const payment = await Payment.findOne({ where: { providerPaymentId: refund.payment_intent }, attributes: ['invoiceId'], transaction });
      invoiceId = payment?.invoiceId;
    }
    const invoice = await lockInvoice(invoiceId, transaction);
    if (!invoice || !(refund.amount > 0)) return null;
    const state = refund.status === 'succeeded' ? 'succeeded' : refund.status === 'failed' || refund.status === 'canceled' ? 'failed' : 'pending';
    const known = await Refund.findOne({ where: { providerRefundId: refund.id }, lock: transaction.LOCK.UPDATE, transaction });
    if (!known) {
      await Refund.create({
        invoiceId: invoice.id, providerRefundId: refund.id, providerPaymentId: refund.payment_intent, state, amountCents: refund.amount, reason: null, requestedBy: null,
      }, { transaction });
    } else if (known.state === 'pending' || (known.state === 'succeeded' && state === 'failed')) {
      await known.update({ state }, { transaction });
    }
    return { invoiceId: invoice.id };
  }

  /** Acts on one verified event, once. */
  async function handle(event: Stripe.Event): Promise<Outcome> {
    let effect: Effect | null = null;
    const outcome = await ctx.sequelize.transaction(async (transaction): Promise<Outcome> => {
      const [, first] = await ProcessedWebhookEvent.findOrCreate({ where: { eventId: event.id }, defaults: { eventId: event.id, type: event.type }, transaction });
      if (!first) return 'duplicate';
      const object = event.data.object as unknown;
      switch (event.type) {
        case 'payment_intent.succeeded':
          effect = await applyIntent(object as IntentObject, true, transaction);
          break;
        case 'payment_intent.payment_failed':
          effect = await applyIntent(object as IntentObject, false, transaction);
          break;
        case 'refund.created':
        case 'refund.updated':
        case 'refund.failed':
          effect = await applyRefund(object as RefundObject, transaction);
          break;
        default:
          return 'ignored';
      }
      return effect ? 'processed' : 'ignored';
    });
    const done = effect as Effect | null;
    if (done) {
      await publishInvoiceChange(ctx, done.invoiceId);
      if (done.overpaymentId) await sendOverpaymentNotice(ctx, done.overpaymentId);
    }
    return outcome;
  }

  return { handle };
}

export type PaymentEventsService = ReturnType<typeof createPaymentEventsService>;
