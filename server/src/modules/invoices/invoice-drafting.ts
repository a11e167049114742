// Drafting and issuing on the database alone (no request, no user session): the invoices
// service wraps these with its authorization and scoping; the demo seed and test builders
// use them directly so they describe the same invoices.
import type { Sequelize, Transaction } from 'sequelize';
import { DateTime } from 'luxon';
import { depositDueOn, reducedRateWording } from '../../../../shared/domain/agreement-billing.js';
import type { Models } from '../../db/models/index.js';
import { priceInvoice, type PricedLine, type PlacementToPrice } from '../../../../shared/domain/invoice-pricing.js';
import { notFound, wrongState } from '../../errors/http-errors.js';
import { selectAgreementTerms, selectPlacementsToBill, type AgreementTermsRow, type PlacementToBillRow } from './invoices.queries.js';
import { takeNextNumber } from './invoice-numbers.js';

/** An app's database: its Sequelize instance and the models bound to it. */
export interface InvoiceDatabase { sequelize: Sequelize; models: Models }

export type AgreementRow = AgreementTermsRow;

export async function loadAgreement(db: InvoiceDatabase, apiaryId: string | null, agreementId: string): Promise<AgreementRow> {
  const agreement = await selectAgreementTerms(db.sequelize, apiaryId, agreementId);
  if (!agreement) throw notFound('That agreement');
  if (agreement.state !== 'in-force' && agreement.state !== 'completed') throw wrongState('Only a signed agreement can be invoiced.');
  return agreement;
}

function describeLine(line: PricedLine, placements: PlacementToBillRow[], agreement: AgreementRow): string {
  const p = placements.find((x) => x.id === line.placementId);
  const where = p ? `${p.site_name}, ${p.block_name}` : '';
  if (line.kind === 'colonies-full-rate') return `Colonies placed at ${where}`;
  if (line.kind === 'colonies-below-minimum') {
    return `Colonies below ${agreement.min_frames_of_bees} frames of bees at ${where} (estimated from the strength check; ${reducedRateWording(agreement.below_minimum_rate_bp)})`;
  }
  return 'Extra moves';
}

export async function priceAgreement(db: InvoiceDatabase, agreement: AgreementRow, extraMoves: number, transaction?: Transaction) {
  const placements = await selectPlacementsToBill(db.sequelize, agreement.id, transaction);
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
      belowMinimumRateBp: agreement.below_minimum_rate_bp, extraMoveFeeCents: agreement.extra_move_fee_cents, minFramesOfBees: agreement.min_frames_of_bees,
    },
    placements: toPrice, extraMoves, taxRateBp: agreement.tax_rate_bp, timeZone: agreement.time_zone,
  });
  const lines = priced.lines.map((line, position) => ({ ...line, position, description: describeLine(line, placements, agreement) }));
  return { priced, lines };
}

/** Inserts a draft invoice and its lines for a loaded agreement; answers its id. */
export async function insertDraft(
  db: InvoiceDatabase, agreement: AgreementRow, input: { extraMoves: number; notes?: string | null; createdBy: string | null }, transaction: Transaction,
): Promise<string> {
  const { priced, lines } = await priceAgreement(db, agreement, input.extraMoves, transaction);
  const invoice = await db.models.Invoice.create(
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
  await db.models.InvoiceLine.bulkCreate(lines.map((l) => ({ ...l, invoiceId: invoice.id })), { transaction });
  return invoice.id;
}

/** Issues a draft of the given apiary with the next gapless number. */
export async function issueDraft(db: InvoiceDatabase, invoiceId: string, apiaryId: string | null, issuedBy: string | null, at: Date): Promise<number> {
  return db.sequelize.transaction(async (transaction) => {
    const invoice = apiaryId ? await db.models.Invoice.findOne({ where: { id: invoiceId, apiaryId }, lock: transaction.LOCK.UPDATE, transaction }) : null;
    if (!invoice) throw notFound('That invoice');
    if (invoice.lifecycle !== 'draft') throw wrongState('This invoice has already been issued.');
    const number = await takeNextNumber(db.models, transaction, invoice.apiaryId, 'invoice');
    // The draft's deposit date is the delivery day; issuing applies the agreement's rule (agreement-billing.ts).
    const agreement = await db.models.Agreement.findByPk(invoice.agreementId, { attributes: ['balanceDueDays'], transaction });
    const issuedOn = DateTime.fromJSDate(at, { zone: invoice.timeZone }).toISODate();
    const depositDue = invoice.depositDueOn && agreement ? depositDueOn(invoice.depositDueOn, issuedOn, agreement.balanceDueDays) : invoice.depositDueOn;
    await invoice.update({ lifecycle: 'issued', number, issuedAt: at, issuedBy, depositDueOn: depositDue }, { transaction });
    return number;
  });
}
