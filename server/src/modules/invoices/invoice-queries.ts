// Reading invoices with what has been credited and paid, scoped to the user's business:
// an apiary sees its own invoices, drafts included; a farm sees those issued to it.
import { QueryTypes, type Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { accruedInterestCents, invoiceStatus, type InvoiceStanding } from '../../../../shared/domain/invoice-pricing.js';
import type { InvoiceSummaryDto } from '../../../../shared/schemas/invoices.js';

export interface InvoiceRow {
  id: string;
  agreement_id: string;
  apiary_id: string;
  farm_id: string;
  apiary_name: string;
  farm_name: string;
  lifecycle: 'draft' | 'issued' | 'void';
  number: number | null;
  currency: string;
  time_zone: string;
  season: number;
  extra_moves: number;
  subtotal_cents: number;
  tax_rate_bp: number;
  tax_cents: number;
  total_cents: number;
  deposit_cents: number;
  deposit_due_on: string | null;
  balance_due_on: string | null;
  late_interest_bp_per_month: number;
  reminder_interval_days: number;
  notes: string | null;
  void_reason: string | null;
  issued_at: Date | null;
  credited_cents: number;
  paid_cents: number;
}

const selectSql = `
  SELECT i.id, i.agreement_id, i.apiary_id, i.farm_id, ap.name AS apiary_name, f.name AS farm_name, i.lifecycle, i.number,
    trim(i.currency) AS currency, i.time_zone, extract(year FROM lower(a.expected_on_site) AT TIME ZONE i.time_zone)::int AS season,
    i.extra_moves, i.subtotal_cents, i.tax_rate_bp, i.tax_cents, i.total_cents, i.deposit_cents,
    to_char(i.deposit_due_on, 'YYYY-MM-DD') AS deposit_due_on, to_char(i.balance_due_on, 'YYYY-MM-DD') AS balance_due_on,
    i.late_interest_bp_per_month, i.reminder_interval_days, i.notes, i.void_reason, i.issued_at,
    coalesce((SELECT sum(c.amount_cents) FROM credit_notes c WHERE c.invoice_id = i.id), 0)::int AS credited_cents,
    (coalesce((SELECT sum(p.amount_cents) FROM payments p WHERE p.invoice_id = i.id AND p.state = 'succeeded'), 0)
     - coalesce((SELECT sum(r.amount_cents) FROM refunds r
                 JOIN payments p ON p.provider_payment_id = r.provider_payment_id AND p.state = 'succeeded'
                 WHERE r.invoice_id = i.id AND r.state = 'succeeded'), 0))::int AS paid_cents
  FROM invoices i
  JOIN agreements a ON a.id = i.agreement_id
  JOIN organizations ap ON ap.id = i.apiary_id
  JOIN organizations f ON f.id = i.farm_id`;

/** Whose invoices: a signed-in user, or a business acting for itself (jobs). */
export type InvoiceScope = Pick<AuthUser, 'id' | 'organizationId' | 'organizationKind'>;

/** Rows the user may see; `where` adds conditions on alias i. */
export async function selectInvoices(ctx: AppContext, user: InvoiceScope, where = 'TRUE', replacements: Record<string, unknown> = {}, transaction?: Transaction): Promise<InvoiceRow[]> {
  const scope = user.organizationKind === 'apiary' ? 'i.apiary_id = :orgId' : "i.farm_id = :orgId AND i.lifecycle <> 'draft'";
  return ctx.sequelize.query<InvoiceRow>(`${selectSql} WHERE ${scope} AND (${where}) ORDER BY i.created_at DESC, i.id`, {
    replacements: { ...replacements, orgId: user.organizationId }, type: QueryTypes.SELECT, transaction,
  });
}

/** Every live invoice (no user scope): for the reminder job. */
export async function selectIssuedInvoices(ctx: AppContext): Promise<InvoiceRow[]> {
  return ctx.sequelize.query<InvoiceRow>(`${selectSql} WHERE i.lifecycle = 'issued' ORDER BY i.issued_at`, { type: QueryTypes.SELECT });
}

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

export function toInvoiceSummary(row: InvoiceRow, asOf: Date): InvoiceSummaryDto {
  const standing = standingOf(row);
  const status = invoiceStatus(row.lifecycle, standing, asOf, row.time_zone);
  const live = status !== 'void' && status !== 'draft';
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
    outstandingCents: live ? standing.netTotalCents - row.paid_cents : 0,
    depositCents: row.deposit_cents,
    depositDueOn: row.deposit_due_on,
    balanceDueOn: row.balance_due_on,
    accruedInterestCents: status === 'overdue' ? accruedInterestCents(standing, row.late_interest_bp_per_month, asOf, row.time_zone) : 0,
    issuedAt: row.issued_at ? new Date(row.issued_at).toISOString() : null,
  };
}
