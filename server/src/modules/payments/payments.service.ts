// Paying invoices: the grower starts an online payment (a checkout session at the
// payments service; what is paid is known only from its verified webhooks), the
// beekeeper records cheques and bank transfers, and refunds online payments (an
// overpayment among them).
import { formatMoney } from '../../../../shared/domain/money.js';
import { DateTime } from 'luxon';
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import type { CheckoutDto, ManualPaymentInput, RefundInput } from '../../../../shared/schemas/invoices.js';
import { notFound, wrongState, badRequest, conflict } from '../../errors/http-errors.js';
import { createError } from '../../errors/create-error.js';
import { selectInvoices } from '../invoices/invoices.queries.js';
import { toInvoiceSummary, formatInvoiceNumber } from '../invoices/invoice-summary.js';
import { publishInvoiceChange } from '../invoices/invoice-events.js';
import { paymentsClient } from './payments-client.js';

const unavailable = (message: string) => createError('unavailable', message, 503);
/** The SDK's answer to a request the service refuses (unknown id, session no longer open...). */
const isRefusedRequest = (err: unknown) => (err as { type?: string } | null)?.type === 'StripeInvalidRequestError';

export function createPaymentsService(ctx: AppContext) {
  const { Invoice, Payment, Refund } = ctx.models;
  const stripe = () => paymentsClient(ctx.config);

  /**
   * Closes the invoice's earlier checkout so two tabs cannot both pay the balance. A
   * session that can no longer be expired has been paid or has lapsed; if it was paid and
   * its payment is not confirmed yet, a new checkout would ask for the same money again.
   */
  async function closeEarlierCheckout(sessionId: string, transaction: Transaction) {
    try {
      await stripe().checkout.sessions.expire(sessionId);
      return;
    } catch (err) {
      if (!isRefusedRequest(err)) {
        ctx.logger.warn({ err }, 'payments service did not expire a checkout session');
        throw unavailable('The payments service is not answering; please try again shortly.');
      }
    }
    let session;
    try {
      session = await stripe().checkout.sessions.retrieve(sessionId);
    } catch (err) {
      if (isRefusedRequest(err)) return; // unknown to the service: nothing left open
      throw unavailable('The payments service is not answering; please try again shortly.');
    }
    const intentId = typeof session.payment_intent === 'string' ? session.payment_intent : session.payment_intent?.id;
    if (session.status !== 'complete' || !intentId) return;
    const confirmed = await Payment.count({ where: { providerPaymentId: intentId, state: 'succeeded' }, transaction });
    if (confirmed === 0) {
      throw conflict('A payment made from an earlier checkout of this invoice is still being confirmed; reload the invoice in a minute before paying again.');
    }
  }

  /**
   * A checkout session for what is outstanding; the browser goes to its URL for the card
   * step. At most one is open per invoice: the invoice row is locked while the earlier one
   * is expired and the new one opened, so two tabs opening checkouts at once queue here.
   */
  async function startCheckout(user: AuthUser, invoiceId: string, appOrigin: string): Promise<CheckoutDto> {
    return ctx.sequelize.transaction(async (transaction) => {
      const invoice = user.organizationId
        ? await Invoice.findOne({ where: { id: invoiceId, farmId: user.organizationId }, lock: transaction.LOCK.UPDATE, transaction })
        : null;
      const [row] = invoice ? await selectInvoices(ctx.sequelize, user, { id: invoiceId, transaction }) : [];
      if (!invoice || !row) throw notFound('That invoice');
      if (row.lifecycle !== 'issued') throw wrongState('Only an issued invoice can be paid.');
      const summary = toInvoiceSummary(row, ctx.now());
      if (summary.outstandingCents <= 0) throw wrongState('This invoice is already paid.');
      if (invoice.openCheckoutSessionId) await closeEarlierCheckout(invoice.openCheckoutSessionId, transaction);
      const returnUrl = `${appOrigin}/invoices/${row.id}`;
      let session;
      try {
        session = await stripe().checkout.sessions.create({
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
      } catch (err) {
        ctx.logger.warn({ err }, 'payments service refused a checkout session');
        throw unavailable('The payments service is not answering; please try again shortly.');
      }
      if (!session.url) throw unavailable('The payments service is not answering; please try again shortly.');
      await invoice.update({ openCheckoutSessionId: session.id }, { transaction });
      return { url: session.url };
    });
  }

  async function recordManual(user: AuthUser, input: ManualPaymentInput) {
    return ctx.sequelize.transaction(async (transaction) => {
      const locked = user.organizationId
        ? await Invoice.findOne({ where: { id: input.invoiceId, apiaryId: user.organizationId }, attributes: ['id'], lock: transaction.LOCK.UPDATE, transaction })
        : null;
      const [row] = locked ? await selectInvoices(ctx.sequelize, user, { id: input.invoiceId, transaction }) : [];
      if (!row) throw notFound('That invoice');
      if (row.lifecycle !== 'issued') throw wrongState('Payments are recorded only on issued invoices.');
      const outstanding = row.total_cents - row.credited_cents - row.paid_cents;
      if (input.amountCents > outstanding) {
        const most = formatMoney(Math.max(0, outstanding), row.currency);
        throw badRequest(`The payment is more than is outstanding (${most}): record at most that, and return the rest to the grower.`, { amountCents: `must be at most ${most}` });
      }
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
    const payment = user.organizationId
      ? await Payment.findOne({ where: { id: paymentId }, include: [{ model: Invoice, as: 'invoice', where: { apiaryId: user.organizationId }, attributes: [] }] })
      : null;
    if (!payment) throw notFound('That payment');
    if (payment.method !== 'online' || payment.state !== 'succeeded' || !payment.providerPaymentId) {
      throw wrongState('Only a completed online payment can be refunded here; correct a check or bank transfer with a credit note.');
    }
    const providerPaymentId = payment.providerPaymentId;
    const refunded = (await Refund.sum('amountCents', { where: { providerPaymentId, state: ['pending', 'succeeded'] } })) ?? 0;
    const refundable = payment.amountCents - refunded;
    if (input.amountCents > refundable) {
      const most = formatMoney(refundable, payment.currency);
      throw badRequest(`At most ${most} of this payment can be refunded.`, { amountCents: `must be at most ${most}` });
    }
    let refundId: string;
    try {
      const created = await stripe().refunds.create({ payment_intent: providerPaymentId, amount: input.amountCents, metadata: { invoice_id: payment.invoiceId } });
      refundId = created.id;
    } catch (err) {
      ctx.logger.warn({ err }, 'payments service refused a refund');
      throw unavailable('The payments service did not accept the refund; nothing was refunded.');
    }
    // The webhook may already have recorded it; it keeps the state it set. The invoice row
    // lock orders this write with the webhook's.
    await ctx.sequelize.transaction(async (transaction) => {
      await Invoice.findOne({ where: { id: payment.invoiceId }, attributes: ['id'], lock: transaction.LOCK.UPDATE, transaction });
      const known = await Refund.findOne({ where: { providerRefundId: refundId }, transaction });
      const who = { reason: input.reason || null, requestedBy: user.id };
      if (known) await known.update(who, { transaction });
      else await Refund.create({ invoiceId: payment.invoiceId, providerRefundId: refundId, providerPaymentId, state: 'pending', amountCents: input.amountCents, ...who }, { transaction });
    });
    return { refundId, invoiceId: payment.invoiceId };
  }

  return { startCheckout, recordManual, refund };
}

export type PaymentsService = ReturnType<typeof createPaymentsService>;
