// Tells both sides of an invoice that it changed (issued, paid, refunded, credited, void),
// so open pages reload it and show a toast.
import type { AppContext } from '../../context.js';
import { publishToOrganizations } from '../../realtime/publish.js';

export async function publishInvoiceChange(ctx: AppContext, invoiceId: string) {
  const invoice = await ctx.models.Invoice.findByPk(invoiceId, { attributes: ['farmId', 'apiaryId', 'lifecycle'] });
  if (!invoice) return;
  const audience = invoice.lifecycle === 'draft' ? [invoice.apiaryId] : [invoice.farmId, invoice.apiaryId];
  publishToOrganizations(ctx.io, audience, 'invoice:updated', { invoiceId });
}
