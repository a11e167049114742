// The invoices module's SQL, where the ORM cannot say it well: invoice rows with what has
// been credited and paid summed in, the agreement and placement rows that price a
// draft, and the report aggregates. Values always travel as replacements or bind
// parameters; pass the caller's transaction so the query runs on its connection.
import type { Sequelize, Transaction } from 'sequelize';
import { queryOne, queryPrepared, queryRows, statementFor } from '../../db/query-rows.js';
import type { AuthUser } from '../auth/auth-user.js';

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

const invoiceSelect = `
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

export interface InvoiceFilter {
  id?: string;
  /** Leave drafts out even for the apiary that wrote them. */
  issuedOrVoidOnly?: boolean;
  transaction?: Transaction;
}

/**
 * Invoice rows the scope may see: an apiary sees its own invoices, drafts included; a farm
 * sees those issued to it.
 */
export function selectInvoices(sequelize: Sequelize, scope: InvoiceScope, filter: InvoiceFilter = {}): Promise<InvoiceRow[]> {
  const conditions = [scope.organizationKind === 'apiary' ? 'i.apiary_id = $orgId::uuid' : "i.farm_id = $orgId::uuid AND i.lifecycle <> 'draft'"];
  if (filter.id !== undefined) conditions.push('i.id = $id::uuid');
  if (filter.issuedOrVoidOnly) conditions.push("i.lifecycle <> 'draft'");
  // The invoice list is read on most pages: one prepared statement per combination of conditions.
  const statement = statementFor('invoices', `${invoiceSelect} WHERE ${conditions.join(' AND ')} ORDER BY i.created_at DESC, i.id`);
  return queryPrepared<InvoiceRow>(sequelize, statement, { orgId: scope.organizationId, id: filter.id ?? null }, filter.transaction);
}

/** One invoice row by id alone (no user scope): for webhooks and jobs. */
export function selectInvoiceById(sequelize: Sequelize, id: string, transaction?: Transaction): Promise<InvoiceRow | undefined> {
  return queryOne<InvoiceRow>(sequelize, `${invoiceSelect} WHERE i.id = :id`, { replacements: { id }, transaction });
}

/** Every issued invoice (no user scope): for the reminder job. */
export function selectIssuedInvoices(sequelize: Sequelize): Promise<InvoiceRow[]> {
  return queryRows<InvoiceRow>(sequelize, `${invoiceSelect} WHERE i.lifecycle = 'issued' ORDER BY i.issued_at`);
}

export interface AgreementTermsRow {
  id: string;
  farm_id: string;
  apiary_id: string;
  state: string;
  price_per_colony_cents: number;
  currency: string;
  deposit_share_bp: number;
  balance_due_days: number;
  late_interest_bp_per_month: number;
  below_minimum_rate_bp: number;
  extra_move_fee_cents: number;
  min_frames_of_bees: number;
  reminder_interval_days: number;
  time_zone: string;
  tax_rate_bp: number;
}

/** An agreement of the apiary with the billing business's time zone and tax rate. */
export function selectAgreementTerms(sequelize: Sequelize, apiaryId: string | null, agreementId: string): Promise<AgreementTermsRow | undefined> {
  return queryOne<AgreementTermsRow>(
    sequelize,
    `SELECT a.id, a.farm_id, a.apiary_id, a.state, a.price_per_colony_cents, trim(a.currency) AS currency, a.deposit_share_bp, a.balance_due_days,
       a.late_interest_bp_per_month, a.below_minimum_rate_bp, a.extra_move_fee_cents, a.min_frames_of_bees, a.reminder_interval_days,
       ap.time_zone, ap.tax_rate_bp
     FROM agreements a JOIN organizations ap ON ap.id = a.apiary_id WHERE a.id = :agreementId AND a.apiary_id = :orgId`,
    { replacements: { agreementId, orgId: apiaryId } },
  );
}

export interface PlacementToBillRow {
  id: string;
  colonies_delivered: number;
  delivered_at: Date | null;
  picked_up_at: Date | null;
  site_name: string;
  block_name: string;
  colonies_in_group: number | null;
  frames_of_bees: number[] | null;
}

/** Delivered placements of an agreement, each with its latest strength check. */
export function selectPlacementsToBill(sequelize: Sequelize, agreementId: string, transaction?: Transaction): Promise<PlacementToBillRow[]> {
  return queryRows<PlacementToBillRow>(
    sequelize,
    // Times sent from the field are the phone's recorded times (never in the future, see
    // shared/domain/recorded-at.ts); a phone clock far behind cannot bill before the agreement was made.
    `SELECT p.id, p.colonies_delivered,
       CASE WHEN p.delivered_received_at IS NULL THEN p.delivered_at ELSE greatest(p.delivered_at, ag.created_at) END AS delivered_at,
       CASE WHEN p.picked_up_received_at IS NULL THEN p.picked_up_at ELSE greatest(p.picked_up_at, ag.created_at) END AS picked_up_at,
       d.name AS site_name, b.name AS block_name,
       sc.colonies_in_group, sc.frames_of_bees
     FROM placements p
     JOIN agreements ag ON ag.id = p.agreement_id
     JOIN drop_sites d ON d.id = p.drop_site_id
     JOIN blocks b ON b.id = d.block_id
     LEFT JOIN LATERAL (SELECT s.colonies_in_group, s.frames_of_bees FROM strength_checks s WHERE s.placement_id = p.id
                        ORDER BY s.checked_at DESC, s.created_at DESC LIMIT 1) sc ON TRUE
     WHERE p.agreement_id = :agreementId AND p.state IN ('delivered', 'picked-up') AND coalesce(p.colonies_delivered, 0) > 0
     ORDER BY p.delivered_at, p.id`,
    { replacements: { agreementId }, transaction },
  );
}

export interface BillableAgreementRow {
  id: string;
  farm_id: string;
  farm_name: string;
  colonies: number;
  delivered: number;
  price_per_colony_cents: number;
  currency: string;
  on_site_from: Date;
}

/** Signed agreements of the apiary with the colonies delivered and no live invoice yet. */
export function selectBillableAgreements(sequelize: Sequelize, apiaryId: string | null): Promise<BillableAgreementRow[]> {
  return queryRows<BillableAgreementRow>(
    sequelize,
    `SELECT a.id, a.farm_id, f.name AS farm_name, a.colonies, a.price_per_colony_cents, trim(a.currency) AS currency, lower(a.expected_on_site) AS on_site_from,
       coalesce((SELECT sum(p.colonies_delivered) FROM placements p WHERE p.agreement_id = a.id AND p.state IN ('delivered', 'picked-up')), 0)::int AS delivered
     FROM agreements a JOIN organizations f ON f.id = a.farm_id
     WHERE a.apiary_id = :orgId AND a.state IN ('in-force', 'completed')
       AND NOT EXISTS (SELECT 1 FROM invoices i WHERE i.agreement_id = a.id AND i.lifecycle <> 'void')
     ORDER BY lower(a.expected_on_site), f.name`,
    { replacements: { orgId: apiaryId } },
  );
}

/** Money received on the invoices, refunds negative, by when it moved. */
export function selectMoneyMovements(sequelize: Sequelize, invoiceIds: string[]): Promise<Array<{ at: Date; cents: number }>> {
  return queryRows(
    sequelize,
    `SELECT coalesce(p.received_at, p.created_at) AS at, p.amount_cents AS cents FROM payments p
       WHERE p.invoice_id IN (:ids) AND p.state = 'succeeded'
     UNION ALL
     SELECT r.created_at, -r.amount_cents FROM refunds r JOIN payments p ON p.provider_payment_id = r.provider_payment_id AND p.state = 'succeeded'
       WHERE r.invoice_id IN (:ids) AND r.state = 'succeeded'`,
    { replacements: { ids: invoiceIds } },
  );
}

export interface BlockChargeRow {
  invoice_id: string;
  block_id: string;
  block_name: string;
  area_m2: number;
  colonies: number;
  charged_cents: number;
}

/** What each invoice charged per block (through its placements). */
export function selectBlockCharges(sequelize: Sequelize, invoiceIds: string[]): Promise<BlockChargeRow[]> {
  return queryRows<BlockChargeRow>(
    sequelize,
    `SELECT l.invoice_id, b.id AS block_id, b.name AS block_name, b.area_m2,
       sum(CASE WHEN l.kind <> 'extra-moves' THEN l.quantity ELSE 0 END)::int AS colonies, sum(l.amount_cents)::int AS charged_cents
     FROM invoice_lines l JOIN placements p ON p.id = l.placement_id JOIN drop_sites d ON d.id = p.drop_site_id JOIN blocks b ON b.id = d.block_id
     WHERE l.invoice_id IN (:ids) GROUP BY l.invoice_id, b.id, b.name, b.area_m2`,
    { replacements: { ids: invoiceIds } },
  );
}
