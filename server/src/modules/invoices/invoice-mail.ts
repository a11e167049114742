// E-mail to the farm's billing contact (its billing address, else its owner) through the
// job queue, with the invoice PDF attached.
import type { AppContext } from '../../context.js';
import type { InvoiceDto } from '../../../../shared/schemas/invoices.js';
import { enqueueEmail } from '../../jobs/send-email.job.js';
import { formatMoney } from '../../../../shared/domain/money.js';
import { renderInvoicePdf } from './invoice-pdf.js';
import { queueNames } from '../../jobs/queue-names.js';
import { createInvoicesService } from './invoices.service.js';

/** Where an organization's invoices go: its billing address, else its first active owner. */
export async function billingContactOf(ctx: AppContext, organizationId: string): Promise<string | null> {
  const org = await ctx.models.Organization.findByPk(organizationId, { attributes: ['id', 'billingEmail'] });
  if (!org) return null;
  if (org.billingEmail) return org.billingEmail;
  const owner = await ctx.models.User.findOne({
    where: { organizationId, role: 'owner', disabledAt: null }, attributes: ['email'], order: [['createdAt', 'ASC']],
  });
  return owner?.email ?? null;
}

export async function sendInvoiceEmail(ctx: AppContext, invoice: InvoiceDto) {
  const to = await billingContactOf(ctx, invoice.farm.id);
  if (!to) {
    ctx.logger.warn({ invoiceId: invoice.id }, 'invoice issued to a farm with no billing contact; no e-mail sent');
    return;
  }
  const pdf = await renderInvoicePdf(invoice);
  const money = (c: number) => formatMoney(c, invoice.currency);
  await enqueueEmail(ctx.jobs, {
    to,
    subject: `Invoice ${invoice.number} from ${invoice.apiary.name}`,
    text: [
      `${invoice.apiary.name} has issued invoice ${invoice.number} for pollination in ${invoice.season}.`,
      `Total: ${money(invoice.totalCents)}. Deposit ${money(invoice.depositCents)} due ${invoice.depositDueOn ?? 'at delivery'};`
        + ` balance due ${invoice.balanceDueOn ?? 'after pickup, as agreed'}.`,
      'Sign in to Pollenpact to pay online or to see the details. The invoice is attached as a PDF.',
    ].join('\n\n'),
    attachments: [{ filename: `${invoice.number}.pdf`, contentType: 'application/pdf', contentBase64: pdf.toString('base64') }],
  });
}

/** Worker: renders the issued invoice's PDF and e-mails it (the e-mail itself is one more queued job). */
export async function startInvoiceEmailWorker(ctx: AppContext) {
  const service = createInvoicesService(ctx);
  await ctx.jobs.addWorker<{ invoiceId: string }>(queueNames.invoiceEmail, async ({ invoiceId }) => {
    const invoice = await ctx.models.Invoice.findOne({ where: { id: invoiceId, lifecycle: 'issued' }, attributes: ['apiaryId'] });
    if (!invoice) return;
    await sendInvoiceEmail(ctx, await service.detail({ id: '', organizationId: invoice.apiaryId, organizationKind: 'apiary' }, invoiceId));
  });
}
