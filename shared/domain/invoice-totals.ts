// The totals of an invoice as its PDF lists them, top to bottom: what it asks (subtotal,
// tax, total), what corrects it (credit notes), what was received and given back, what is
// still due, and money paid beyond what it asks, to be returned. Pure: from the invoice as
// the server reports it (paid is net of completed refunds).
import type { InvoiceDto } from '../schemas/invoices.js';

export interface InvoiceTotalRow {
  label: string;
  /** Signed as it adds up: credit notes and payments lower what is due, refunds raise it again. */
  cents: number;
  /** The rows a reader looks for: the total, and what is due (or to be returned). */
  strong?: boolean;
}

type TotalsOf = Pick<InvoiceDto, 'subtotalCents' | 'taxRateBp' | 'taxCents' | 'totalCents' | 'creditNotes' | 'paidCents' | 'outstandingCents' | 'overpaidCents' | 'refunds'>;

export function invoiceTotals(invoice: TotalsOf): InvoiceTotalRow[] {
  const refunded = invoice.refunds.filter((r) => r.state === 'succeeded').reduce((sum, r) => sum + r.amountCents, 0);
  const rows: InvoiceTotalRow[] = [
    { label: 'Subtotal', cents: invoice.subtotalCents },
    { label: `Tax (${invoice.taxRateBp / 100}%)`, cents: invoice.taxCents },
    { label: 'Total', cents: invoice.totalCents, strong: true },
    ...invoice.creditNotes.map((note) => ({ label: `Credit note ${note.number}`, cents: -note.amountCents })),
    { label: 'Paid', cents: -(invoice.paidCents + refunded) },
  ];
  if (refunded > 0) rows.push({ label: 'Refunded', cents: refunded });
  rows.push({ label: 'Amount due', cents: invoice.outstandingCents, strong: true });
  if (invoice.overpaidCents > 0) rows.push({ label: 'Overpaid, to be refunded', cents: invoice.overpaidCents, strong: true });
  return rows;
}
