// Tells both sides of an invoice that it changed (issued, paid, refunded, credited, void),
// so open pages reload it and show a toast.
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../../context.js';
import { publishToOrganizations } from '../../realtime/publish.js';

export async function publishInvoiceChange(ctx: AppContext, invoiceId: string) {
  const [row] = await ctx.sequelize.query<{ farm_id: string; apiary_id: string; lifecycle: string }>(
    'SELECT farm_id, apiary_id, lifecycle FROM invoices WHERE id = :invoiceId', { replacements: { invoiceId }, type: QueryTypes.SELECT },
  );
  if (!row) return;
  const audience = row.lifecycle === 'draft' ? [row.apiary_id] : [row.farm_id, row.apiary_id];
  publishToOrganizations(ctx.io, audience, 'invoice:updated', { invoiceId });
}
