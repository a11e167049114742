// An invoice row as both sides see it: numbers formatted, the status worked out from
// payments, credit notes and the date, what is still owed and what was paid beyond it.
import { accruedInterestCents, invoiceStatus, type InvoiceStanding } from '../../../../shared/domain/invoice-pricing.js';
import type { InvoiceSummaryDto } from '../../../../shared/schemas/invoices.js';
import type { InvoiceRow } from './invoices.queries.js';
import type { Payment } from '../../db/models/payment.model.js';
import type { Refund } from '../../db/models/refund.model.js';

export const formatInvoiceNumber = (n: number | null) => (n === null ? null : `INV-${String(n).padStart(5, '0')}`);
export const formatCreditNoteNumber = (n: number) => `CN-${String(n).padStart(5, '0')}`;

export function standingOf(row: InvoiceRow): InvoiceStanding {
  return {
    netTotalCents: row.total_cents - row.credited_cents,
    paidCents: row.paid_cents,
    depositCents: row.deposit_cents,
    depositDueOn: row.deposit_due_on,
    balanceDueOn: row.balance_due_on,
  };
}

/** What is still owed on an issued invoice (never below zero: an excess is an overpayment). */
export function owedCents(row: InvoiceRow): number {
  return row.lifecycle === 'issued' ? Math.max(0, row.total_cents - row.credited_cents - row.paid_cents) : 0;
}

/** Money held beyond what the invoice asks: on a void invoice all of it. */
export function overpaidCents(row: InvoiceRow): number {
  if (row.lifecycle === 'draft') return 0;
  const asked = row.lifecycle === 'issued' ? row.total_cents - row.credited_cents : 0;
  return Math.max(0, row.paid_cents - asked);
}

export function toInvoiceSummary(row: InvoiceRow, asOf: Date): InvoiceSummaryDto {
  const standing = standingOf(row);
  const status = invoiceStatus(row.lifecycle, standing, asOf, row.time_zone);
  return {
    id: row.id,
    number: formatInvoiceNumber(row.number),
    status,
    agreementId: row.agreement_id,
    season: row.season,
    farm: { id: row.farm_id, name: row.farm_name },
    apiary: { id: row.apiary_id, name: row.apiary_name },
    currency: row.currency,
    timeZone: row.time_zone,
    totalCents: row.total_cents,
    creditedCents: row.credited_cents,
    netTotalCents: standing.netTotalCents,
    paidCents: row.paid_cents,
    outstandingCents: owedCents(row),
    overpaidCents: overpaidCents(row),
    depositCents: row.deposit_cents,
    depositDueOn: row.deposit_due_on,
    balanceDueOn: row.balance_due_on,
    accruedInterestCents: status === 'overdue' ? accruedInterestCents(standing, row.late_interest_bp_per_month, asOf, row.time_zone) : 0,
    issuedAt: row.issued_at ? new Date(row.issued_at).toISOString() : null,
  };
}

/** Refunds in the given states summed per online payment (by the service's payment id). */
export function refundedByPayment(refunds: Refund[], states: Array<Refund['state']> = ['succeeded']): Map<string, number> {
  const sums = new Map<string, number>();
  for (const r of refunds) if (states.includes(r.state)) sums.set(r.providerPaymentId, (sums.get(r.providerPaymentId) ?? 0) + r.amountCents);
  return sums;
}

export const refundedOf = (payment: Payment, sums: Map<string, number>) => (payment.providerPaymentId ? sums.get(payment.providerPaymentId) ?? 0 : 0);

