// Paying invoices: the grower starts an online payment (a checkout session at the
// payments service; what is paid is known only from its verified webhooks), the
// beekeeper records cheques and bank transfers, and refunds online payments.
import { QueryTypes } from 'sequelize';
import { DateTime } from 'luxon';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { Payment } from '../../db/models/payment.model.js';
import type { CheckoutDto, ManualPaymentInput, RefundInput } from '../../../../shared/schemas/invoices.js';
import { notFound, wrongState, badRequest } from '../../errors/http-errors.js';
import { createError } from '../../errors/create-error.js';
import { selectInvoices, toInvoiceSummary, formatInvoiceNumber } from '../invoices/invoice-queries.js';
import { publishInvoiceChange } from '../invoices/invoice-events.js';
import { paymentsClient } from './payments-client.js';

export function createPaymentsService(ctx: AppContext) {
  async function openInvoice(user: AuthUser, invoiceId: string) {
    const [row] = await selectInvoices(ctx, user, 'i.id = :invoiceId', { invoiceId });
    if (!row) throw notFound('That invoice');
    const summary = toInvoiceSummary(row, ctx.now());
    if (row.lifecycle !== 'issued') throw wrongState('Only an issued invoice can be paid.');
    if (summary.outstandingCents <= 0) throw wrongState('This invoice is already paid.');
    return { row, summary };
  }

  /** A checkout session for what is outstanding; the browser goes to its URL for the card step. */
  async function startCheckout(user: AuthUser, invoiceId: string, appOrigin: string): Promise<CheckoutDto> {
    const { row, summary } = await openInvoice(user, invoiceId);
    const returnUrl = `${appOrigin}/invoices/${row.id}`;
    try {
      const session = await paymentsClient(ctx.config).checkout.sessions.create({
        mode: 'payment',
        client_reference_id: row.id,
        line_items: [{
          quantity: 1,
          price_data: { currency: row.currency.toLowerCase(), unit_amount: summary.outstandingCents, product_data: { name: `Invoice ${formatInvoiceNumber(row.number)} from ${row.apiary_name}` } },
        }],
        metadata: { invoice_id: row.id },
        payment_intent_data: { metadata: { invoice_id: row.id } },
        success_url: `${returnUrl}?payment=returned`,
        cancel_url: `${returnUrl}?payment=cancelled`,
      });
      if (!session.url) throw new Error('checkout session without a URL');
      return { url: session.url };
    } catch (err) {
      ctx.logger.warn({ err }, 'payments service refused a checkout session');
      throw createError('unavailable', 'The payments service is not answering; please try again shortly.', 503);
    }
  }

  async function recordManual(user: AuthUser, input: ManualPaymentInput) {
    return ctx.sequelize.transaction(async (transaction) => {
      await ctx.sequelize.query('SELECT 1 FROM invoices WHERE id = :id AND apiary_id = :orgId FOR UPDATE', { replacements: { id: input.invoiceId, orgId: user.organizationId }, transaction });
      const [row] = await selectInvoices(ctx, user, 'i.id = :invoiceId', { invoiceId: input.invoiceId }, transaction);
      if (!row) throw notFound('That invoice');
      if (row.lifecycle !== 'issued') throw wrongState('Payments are recorded only on issued invoices.');
      const outstanding = row.total_cents - row.credited_cents - row.paid_cents;
      if (input.amountCents > outstanding) throw badRequest(`The payment is more than is outstanding (${outstanding} cents).`, { amountCents: `must be at most ${outstanding}` });
      const now = ctx.now();
      if (input.receivedOn > DateTime.fromJSDate(now, { zone: row.time_zone }).toISODate()!) {
        throw badRequest('A payment cannot be received in the future.', { receivedOn: 'must not be in the future' });
      }
      // Noon of the day received, in the business's time zone (never later than now).
      const noon = DateTime.fromISO(input.receivedOn, { zone: row.time_zone }).set({ hour: 12 }).toJSDate();
      const receivedAt = noon > now ? now : noon;
      const payment = await Payment.create({
        invoiceId: row.id, method: input.method, state: 'succeeded', amountCents: input.amountCents, currency: row.currency, providerPaymentId: null,
        failureMessage: null, reference: input.reference || null, receivedAt, recordedBy: user.id,
      }, { transaction });
      transaction.afterCommit(() => publishInvoiceChange(ctx, row.id));
      return { paymentId: payment.id, invoiceId: row.id };
    });
  }

  /** Asks the payments service for a refund; the balance changes when its webhook confirms it. */
  async function refund(user: AuthUser, paymentId: string, input: RefundInput) {
    const [payment] = await ctx.sequelize.query<{ id: string; invoice_id: string; method: string; state: string; amount_cents: number; provider_payment_id: string | null; refunded_cents: number }>(
      `SELECT p.id, p.invoice_id, p.method, p.state, p.amount_cents, p.provider_payment_id,
         coalesce((SELECT sum(r.amount_cents) FROM refunds r WHERE r.provider_payment_id = p.provider_payment_id AND r.state IN ('pending', 'succeeded')), 0)::int AS refunded_cents
       FROM payments p JOIN invoices i ON i.id = p.invoice_id WHERE p.id = :paymentId AND i.apiary_id = :orgId`,
      { replacements: { paymentId, orgId: user.organizationId }, type: QueryTypes.SELECT },
    );
    if (!payment) throw notFound('That payment');
    if (payment.method !== 'online' || payment.state !== 'succeeded' || !payment.provider_payment_id) {
      throw wrongState('Only a completed online payment can be refunded here; correct a cheque or transfer with a credit note.');
    }
    const refundable = payment.amount_cents - payment.refunded_cents;
    if (input.amountCents > refundable) throw badRequest(`At most ${refundable} cents of this payment can be refunded.`, { amountCents: `must be at most ${refundable}` });
    let refundId: string;
    try {
      const refunded = await paymentsClient(ctx.config).refunds.create({
        payment_intent: payment.provider_payment_id, amount: input.amountCents, metadata: { invoice_id: payment.invoice_id },
      });
      refundId = refunded.id;
    } catch (err) {
      ctx.logger.warn({ err }, 'payments service refused a refund');
      throw createError('unavailable', 'The payments service did not accept the refund; nothing was refunded.', 503);
    }
    // The webhook may already have recorded it; it keeps the state it set.
    await ctx.sequelize.query(
      `INSERT INTO refunds (invoice_id, provider_refund_id, provider_payment_id, state, amount_cents, reason, requested_by)
       VALUES (:invoiceId, :refundId, :paymentIntent, 'pending', :amount, :reason, :userId)
       ON CONFLICT (provider_refund_id) DO UPDATE SET reason = EXCLUDED.reason, requested_by = EXCLUDED.requested_by`,
      { replacements: { invoiceId: payment.invoice_id, refundId, paymentIntent: payment.provider_payment_id, amount: input.amountCents, reason: input.reason || null, userId: user.id } },
    );
    return { refundId, invoiceId: payment.invoice_id };
  }

  return { startCheckout, recordManual, refund };
}

export type PaymentsService = ReturnType<typeof createPaymentsService>;
