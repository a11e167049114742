// Tells both sides by e-mail that an online payment went beyond what was owed (two
// checkouts paid for one balance, say), how much, and that the beekeeper refunds it from
// the invoice. The invoice itself shows the overpayment to both sides.
import type { AppContext } from '../../context.js';
import type { Invoice } from '../../db/models/invoice.model.js';
import { enqueueEmail } from '../../jobs/send-email.job.js';
import { formatMoney } from '../../../../shared/domain/money.js';
import { billingContactOf } from '../invoices/invoice-mail.js';
import { formatInvoiceNumber } from '../invoices/invoice-summary.js';

export async function sendOverpaymentNotice(ctx: AppContext, paymentId: string) {
  const { Payment, Organization } = ctx.models;
  const payment = await Payment.findByPk(paymentId, {
    include: [{
      model: ctx.models.Invoice, as: 'invoice', attributes: ['id', 'number', 'farmId', 'apiaryId'],
      include: [{ model: Organization, as: 'farm', attributes: ['name'] }, { model: Organization, as: 'apiary', attributes: ['name'] }],
    }],
  });
  const invoice = payment?.get('invoice') as (Invoice & { farm: { name: string }; apiary: { name: string } }) | undefined;
  if (!payment || !invoice || payment.overpaidCents <= 0) return;
  const money = (cents: number) => formatMoney(cents, payment.currency.trim());
  const number = formatInvoiceNumber(invoice.number) ?? 'an invoice';
  const facts = `An online payment of ${money(payment.amountCents)} on invoice ${number} (${invoice.apiary.name} to ${invoice.farm.name}) `
    + `arrived when ${money(payment.amountCents - payment.overpaidCents)} was owed: ${money(payment.overpaidCents)} was paid beyond the balance.`;
  const sides = [
    { orgId: invoice.farmId, next: `${invoice.apiary.name} has been asked to refund it; the invoice in Pollenpact shows the overpayment until it is refunded.` },
    { orgId: invoice.apiaryId, next: 'Open the invoice in Pollenpact to refund the overpayment to the grower (Refund on the payment).' },
  ];
  for (const side of sides) {
    const to = await billingContactOf(ctx, side.orgId);
    if (!to) continue;
    await enqueueEmail(ctx.jobs, { to, subject: `Overpayment on invoice ${number}: ${money(payment.overpaidCents)} to refund`, text: [facts, side.next].join('\n\n') });
  }
}
