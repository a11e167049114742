// Drafting and issuing on the database alone (no request, no user session): the invoices
// service wraps these with its authorization and scoping; the demo seed and test builders
// use them directly so they describe the same invoices.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { Invoice } from '../../db/models/invoice.model.js';
import { InvoiceLine } from '../../db/models/invoice-line.model.js';
import { priceInvoice, type PricedLine, type PlacementToPrice } from '../../../../shared/domain/invoice-pricing.js';
import { notFound, wrongState } from '../../errors/http-errors.js';
import { takeNextNumber } from './invoice-numbers.js';

export interface AgreementRow {
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

interface PlacementRow {
  id: string;
  colonies_delivered: number;
  delivered_at: Date | null;
  picked_up_at: Date | null;
  site_name: string;
  block_name: string;
  colonies_in_group: number | null;
  frames_of_bees: number[] | null;
}

export async function loadAgreement(sequelize: Sequelize, apiaryId: string | null, agreementId: string): Promise<AgreementRow> {
  const [agreement] = await sequelize.query<AgreementRow>(
    `SELECT a.id, a.farm_id, a.apiary_id, a.state, a.price_per_colony_cents, trim(a.currency) AS currency, a.deposit_share_bp, a.balance_due_days,
       a.late_interest_bp_per_month, a.below_minimum_rate_bp, a.extra_move_fee_cents, a.min_frames_of_bees, a.reminder_interval_days,
       ap.time_zone, ap.tax_rate_bp
     FROM agreements a JOIN organizations ap ON ap.id = a.apiary_id WHERE a.id = :agreementId AND a.apiary_id = :orgId`,
    { replacements: { agreementId, orgId: apiaryId }, type: QueryTypes.SELECT },
  );
  if (!agreement) throw notFound('That agreement');
  if (agreement.state !== 'in-force' && agreement.state !== 'completed') throw wrongState('Only a signed agreement can be invoiced.');
  return agreement;
}

async function loadPlacements(sequelize: Sequelize, agreementId: string): Promise<PlacementRow[]> {
  return sequelize.query<PlacementRow>(
    `SELECT p.id, p.colonies_delivered, p.delivered_at, p.picked_up_at, d.name AS site_name, b.name AS block_name,
       sc.colonies_in_group, sc.frames_of_bees
     FROM placements p
     JOIN drop_sites d ON d.id = p.drop_site_id
     JOIN blocks b ON b.id = d.block_id
     LEFT JOIN LATERAL (SELECT s.colonies_in_group, s.frames_of_bees FROM strength_checks s WHERE s.placement_id = p.id
                        ORDER BY s.checked_at DESC, s.created_at DESC LIMIT 1) sc ON TRUE
     WHERE p.agreement_id = :agreementId AND p.state IN ('delivered', 'picked-up') AND coalesce(p.colonies_delivered, 0) > 0
     ORDER BY p.delivered_at, p.id`,
    { replacements: { agreementId }, type: QueryTypes.SELECT },
  );
}

function describeLine(line: PricedLine, placements: PlacementRow[], agreement: AgreementRow): string {
  const p = placements.find((x) => x.id === line.placementId);
  const where = p ? `${p.site_name}, ${p.block_name}` : '';
  if (line.kind === 'colonies-full-rate') return `Colonies placed at ${where}`;
  if (line.kind === 'colonies-below-minimum') {
    return `Colonies below ${agreement.min_frames_of_bees} frames of bees at ${where} (estimated from the strength check; charged at ${agreement.below_minimum_rate_bp / 100}%)`;
  }
  return 'Extra moves';
}

export async function priceAgreement(sequelize: Sequelize, agreement: AgreementRow, extraMoves: number) {
  const placements = await loadPlacements(sequelize, agreement.id);
  if (placements.length === 0) throw wrongState('No colonies have been delivered on this agreement yet, so there is nothing to invoice.');
  const toPrice: PlacementToPrice[] = placements.map((p) => ({
    placementId: p.id,
    coloniesDelivered: p.colonies_delivered,
    deliveredAt: p.delivered_at ? new Date(p.delivered_at) : null,
    pickedUpAt: p.picked_up_at ? new Date(p.picked_up_at) : null,
    strengthCheck: p.frames_of_bees && p.colonies_in_group ? { coloniesInGroup: p.colonies_in_group, framesOfBees: p.frames_of_bees.map(Number) } : null,
  }));
  const priced = priceInvoice({
    terms: {
      pricePerColonyCents: agreement.price_per_colony_cents, depositShareBp: agreement.deposit_share_bp, balanceDueDays: agreement.balance_due_days,
      belowMinimumRateBp: agreement.below_minimum_rate_bp, extraMoveFeeCents: agreement.extra_move_fee_cents, minFramesOfBees: Number(agreement.min_frames_of_bees),
    },
    placements: toPrice, extraMoves, taxRateBp: agreement.tax_rate_bp, timeZone: agreement.time_zone,
  });
  const lines = priced.lines.map((line, position) => ({ ...line, position, description: describeLine(line, placements, agreement) }));
  return { priced, lines };
}

/** Inserts a draft invoice and its lines for a loaded agreement; answers its id. */
export async function insertDraft(
  sequelize: Sequelize, agreement: AgreementRow, input: { extraMoves: number; notes?: string | null; createdBy: string | null }, transaction: Transaction,
): Promise<string> {
  const { priced, lines } = await priceAgreement(sequelize, agreement, input.extraMoves);
  const invoice = await Invoice.create(
    {
      agreementId: agreement.id, apiaryId: agreement.apiary_id, farmId: agreement.farm_id, number: null, currency: agreement.currency,
      timeZone: agreement.time_zone, extraMoves: input.extraMoves, subtotalCents: priced.subtotalCents, taxRateBp: priced.taxRateBp,
      taxCents: priced.taxCents, totalCents: priced.totalCents, depositCents: priced.depositCents, depositDueOn: priced.depositDueOn,
      balanceDueOn: priced.balanceDueOn, lateInterestBpPerMonth: agreement.late_interest_bp_per_month,
      reminderIntervalDays: agreement.reminder_interval_days, notes: input.notes || null, issuedAt: null, issuedBy: null, voidedAt: null,
      voidReason: null, createdBy: input.createdBy,
    },
    { transaction },
  );
  await InvoiceLine.bulkCreate(lines.map((l) => ({ ...l, invoiceId: invoice.id })), { transaction });
  return invoice.id;
}

/** Issues a draft of the given apiary with the next gapless number. */
export async function issueDraft(sequelize: Sequelize, invoiceId: string, apiaryId: string | null, issuedBy: string | null, at: Date): Promise<number> {
  return sequelize.transaction(async (transaction) => {
    const [row] = await sequelize.query<{ lifecycle: string; apiary_id: string }>(
      'SELECT lifecycle, apiary_id FROM invoices WHERE id = :invoiceId AND apiary_id = :apiaryId FOR UPDATE',
      { replacements: { invoiceId, apiaryId }, type: QueryTypes.SELECT, transaction },
    );
    if (!row) throw notFound('That invoice');
    if (row.lifecycle !== 'draft') throw wrongState('This invoice has already been issued.');
    const number = await takeNextNumber(sequelize, transaction, row.apiary_id, 'invoice');
    await Invoice.update({ lifecycle: 'issued', number, issuedAt: at, issuedBy }, { where: { id: invoiceId }, transaction });
    return number;
  });
}
