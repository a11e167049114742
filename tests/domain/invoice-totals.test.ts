// The totals an invoice PDF lists, checked as a ledger adds up (bookkeeping arithmetic,
// common practice, no source): from the total down, credit notes and payments received
// subtract, refunds given back add, and what is left is the amount due, or, below zero,
// money paid beyond the total that is to be returned. Amounts are worked out beside each check.
import { describe, it, expect } from 'vitest';
import { invoiceTotals, type InvoiceTotalRow } from '../../shared/domain/invoice-totals.js';

const base = { subtotalCents: 0, taxRateBp: 0, taxCents: 0, totalCents: 0, creditNotes: [], paidCents: 0, outstandingCents: 0, overpaidCents: 0, refunds: [] };
const note = (number: string, amountCents: number) => ({ id: number, number, amountCents, reason: 'late colonies', createdAt: '2027-05-01T00:00:00Z' });
const refund = (amountCents: number, state: 'pending' | 'succeeded' | 'failed') => ({ id: `${state}-${amountCents}`, state, amountCents, reason: null, createdAt: '2027-05-02T00:00:00Z' });

/** From the total down to the row before "Amount due": what the ledger leaves. */
function ledgerBalance(rows: InvoiceTotalRow[]): number {
  const from = rows.findIndex((r) => r.label === 'Total');
  const to = rows.findIndex((r) => r.label === 'Amount due');
  return rows.slice(from, to).reduce((sum, r) => sum + r.cents, 0);
}

describe('invoice totals as the PDF lists them', () => {
  it('lists total, payments and amount due for a partly paid invoice', () => {
    // 12 colonies x $70.00 = $840.00 + 7.25% tax $60.90 = $900.90; a $450.45 deposit paid -> $450.45 due.
    const rows = invoiceTotals({ ...base, subtotalCents: 84_000, taxRateBp: 725, taxCents: 6_090, totalCents: 90_090, paidCents: 45_045, outstandingCents: 45_045 });
    expect(rows).toEqual([
      { label: 'Subtotal', cents: 84_000 },
      { label: 'Tax (7.25%)', cents: 6_090 },
      { label: 'Total', cents: 90_090, strong: true },
      { label: 'Paid', cents: -45_045 },
      { label: 'Amount due', cents: 45_045, strong: true },
    ]);
    expect(ledgerBalance(rows)).toBe(45_045);
  });

  it('shows a credit note, both payments of a double payment, the refund given back and the overpayment left to return', () => {
    // $500.00 total, a $50.00 credit note -> $450.00 asked. Two checkouts paid $450.00 each = $900.00
    // received; $250.00 refunded so far (a $100.00 refund still pending counts for nothing yet):
    // paid net $650.00, $200.00 beyond the $450.00 asked.
    const rows = invoiceTotals({
      ...base, subtotalCents: 50_000, totalCents: 50_000, creditNotes: [note('CN-00003', 5_000)],
      paidCents: 65_000, outstandingCents: 0, overpaidCents: 20_000, refunds: [refund(25_000, 'succeeded'), refund(10_000, 'pending'), refund(3_000, 'failed')],
    });
    expect(rows.slice(2)).toEqual([
      { label: 'Total', cents: 50_000, strong: true },
      { label: 'Credit note CN-00003', cents: -5_000 },
      { label: 'Paid', cents: -90_000 },
      { label: 'Refunded', cents: 25_000 },
      { label: 'Amount due', cents: 0, strong: true },
      { label: 'Overpaid, to be refunded', cents: 20_000, strong: true },
    ]);
    // 500 - 50 - 900 + 250 = -200: the $200.00 to return.
    expect(ledgerBalance(rows)).toBe(-20_000);
  });
});
