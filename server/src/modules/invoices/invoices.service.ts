// Invoices from agreements: draft from the confirmed placements (priced by
// shared/domain/invoice-pricing), review, issue with a gapless number, void while nothing
// is paid, correct by credit note. Issued invoices are never edited.
import { formatMoney } from '../../../../shared/domain/money.js';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import type {
  DraftInvoiceInput, UpdateDraftInput, VoidInvoiceInput, CreditNoteInput, InvoiceDto, InvoiceListQuery, InvoiceSummaryDto, BillableAgreementDto,
} from '../../../../shared/schemas/invoices.js';
import { notFound, wrongState, conflict, badRequest } from '../../errors/http-errors.js';
import { selectInvoices, selectBillableAgreements, type InvoiceRow, type InvoiceScope } from './invoices.queries.js';
import { takeNextNumber } from './invoice-numbers.js';
import { toInvoiceSummary, formatCreditNoteNumber, refundedByPayment, refundedOf } from './invoice-summary.js';
import { loadAgreement, priceAgreement, insertDraft, issueDraft } from './invoice-drafting.js';
import { queueNames } from '../../jobs/queue-names.js';
import { publishInvoiceChange } from './invoice-events.js';

export function createInvoicesService(ctx: AppContext) {
  const { Invoice, InvoiceLine, CreditNote, Payment, Refund } = ctx.models;

  async function findRow(user: InvoiceScope, id: string): Promise<InvoiceRow> {
    const [row] = await selectInvoices(ctx.sequelize, user, { id });
    if (!row) throw notFound('That invoice');
    return row;
  }

  /** Locks the apiary's invoice row for the transaction and reads it as the user sees it. */
  async function lockOwnRow(user: InvoiceScope, id: string, transaction: Transaction): Promise<InvoiceRow> {
    const locked = user.organizationKind === 'apiary' && user.organizationId
      ? await Invoice.findOne({ where: { id, apiaryId: user.organizationId }, attributes: ['id'], lock: transaction.LOCK.UPDATE, transaction })
      : null;
    const [row] = locked ? await selectInvoices(ctx.sequelize, user, { id, transaction }) : [];
    if (!row) throw notFound('That invoice');
    return row;
  }

  async function detail(user: InvoiceScope, id: string): Promise<InvoiceDto> {
    const row = await findRow(user, id);
    const [lines, creditNotes, payments, refunds] = await Promise.all([
      InvoiceLine.findAll({ where: { invoiceId: id }, order: [['position', 'ASC']] }),
      CreditNote.findAll({ where: { invoiceId: id }, order: [['number', 'ASC']] }),
      Payment.findAll({ where: { invoiceId: id }, order: [['createdAt', 'ASC'], ['id', 'ASC']] }),
      Refund.findAll({ where: { invoiceId: id }, order: [['createdAt', 'ASC'], ['id', 'ASC']] }),
    ]);
    const refunded = refundedByPayment(refunds);
    return {
      ...toInvoiceSummary(row, ctx.now()),
      extraMoves: row.extra_moves,
      subtotalCents: row.subtotal_cents,
      taxRateBp: row.tax_rate_bp,
      taxCents: row.tax_cents,
      lateInterestBpPerMonth: row.late_interest_bp_per_month,
      reminderIntervalDays: row.reminder_interval_days,
      notes: row.notes,
      voidReason: row.void_reason,
      lines: lines.map((l) => ({ id: l.id, kind: l.kind, description: l.description, quantity: l.quantity, unitCents: l.unitCents, amountCents: l.amountCents })),
      creditNotes: creditNotes.map((c) => ({ id: c.id, number: formatCreditNoteNumber(c.number), amountCents: c.amountCents, reason: c.reason, createdAt: c.createdAt.toISOString() })),
      payments: payments.map((p) => ({
        id: p.id, method: p.method, state: p.state, amountCents: p.amountCents, refundedCents: refundedOf(p, refunded), overpaidCents: p.overpaidCents,
        reference: p.reference, failureMessage: p.failureMessage, receivedAt: p.receivedAt ? p.receivedAt.toISOString() : null, createdAt: p.createdAt.toISOString(),
      })),
      refunds: refunds.map((r) => ({ id: r.id, state: r.state, amountCents: r.amountCents, reason: r.reason, createdAt: r.createdAt.toISOString() })),
    };
  }

  async function list(user: InvoiceScope, query: InvoiceListQuery): Promise<InvoiceSummaryDto[]> {
    const rows = await selectInvoices(ctx.sequelize, user);
    const asOf = ctx.now();
    return rows
      .map((row) => toInvoiceSummary(row, asOf))
      .filter((s) => (!query.status || s.status === query.status) && (!query.season || s.season === query.season));
  }

  async function draft(user: InvoiceScope, input: DraftInvoiceInput): Promise<InvoiceDto> {
    const agreement = await loadAgreement(ctx, user.organizationId, input.agreementId);
    let invoiceId: string;
    try {
      invoiceId = await ctx.sequelize.transaction((transaction) =>
        insertDraft(ctx, agreement, { extraMoves: input.extraMoves, notes: input.notes, createdBy: user.id }, transaction));
    } catch (err) {
      if (err instanceof UniqueConstraintError) throw conflict('This agreement already has an invoice; void it before drafting another.', { agreementId: 'already invoiced' });
      throw err;
    }
    await publishInvoiceChange(ctx, invoiceId);
    return detail(user, invoiceId);
  }

  /** Re-prices a draft from the current placements, with the given extra moves and notes. */
  async function updateDraft(user: InvoiceScope, id: string, input: UpdateDraftInput): Promise<InvoiceDto> {
    const row = await findRow(user, id);
    if (user.organizationKind !== 'apiary') throw notFound('That invoice');
    if (row.lifecycle !== 'draft') throw wrongState('An issued invoice cannot be changed; add a credit note to correct it.');
    const agreement = await loadAgreement(ctx, user.organizationId, row.agreement_id);
    const extraMoves = input.extraMoves ?? row.extra_moves;
    await ctx.sequelize.transaction(async (transaction) => {
      const { priced, lines } = await priceAgreement(ctx, agreement, extraMoves, transaction);
      const [count] = await Invoice.update(
        {
          extraMoves, subtotalCents: priced.subtotalCents, taxRateBp: priced.taxRateBp, taxCents: priced.taxCents, totalCents: priced.totalCents,
          depositCents: priced.depositCents, depositDueOn: priced.depositDueOn, balanceDueOn: priced.balanceDueOn,
          notes: input.notes === undefined ? row.notes : input.notes || null,
        },
        { where: { id, lifecycle: 'draft' }, transaction },
      );
      if (count === 0) throw wrongState('The invoice was issued meanwhile; it can no longer be changed.');
      await InvoiceLine.destroy({ where: { invoiceId: id }, transaction });
      await InvoiceLine.bulkCreate(lines.map((l) => ({ ...l, invoiceId: id })), { transaction });
    });
    return detail(user, id);
  }

  async function discardDraft(user: InvoiceScope, id: string): Promise<void> {
    await findRow(user, id);
    const deleted = await Invoice.destroy({ where: { id, apiaryId: user.organizationId!, lifecycle: 'draft' } });
    if (deleted === 0) throw wrongState('Only a draft can be discarded; void an issued invoice instead.');
  }

  async function issue(user: InvoiceScope, id: string): Promise<InvoiceDto> {
    await issueDraft(ctx, id, user.organizationId, user.id, ctx.now());
    // The PDF and e-mail are made by a job, so issuing stays quick and survives a mail outage.
    await ctx.jobs.send(queueNames.invoiceEmail, { invoiceId: id });
    await publishInvoiceChange(ctx, id);
    return detail(user, id);
  }

  async function voidInvoice(user: InvoiceScope, id: string, input: VoidInvoiceInput): Promise<InvoiceDto> {
    await ctx.sequelize.transaction(async (transaction) => {
      const row = await lockOwnRow(user, id, transaction);
      if (row.lifecycle === 'draft') throw wrongState('A draft is discarded, not voided.');
      if (row.lifecycle === 'void') throw wrongState('This invoice is already void.');
      const payments = await Payment.count({ where: { invoiceId: id, state: ['succeeded', 'pending'] }, transaction });
      if (payments > 0) throw wrongState('This invoice has payments; correct it with a credit note (and refund) instead of voiding it.');
      await Invoice.update({ lifecycle: 'void', voidedAt: ctx.now(), voidReason: input.reason }, { where: { id }, transaction });
    });
    await publishInvoiceChange(ctx, id);
    return detail(user, id);
  }

  async function addCreditNote(user: InvoiceScope, id: string, input: CreditNoteInput): Promise<InvoiceDto> {
    await ctx.sequelize.transaction(async (transaction) => {
      const row = await lockOwnRow(user, id, transaction);
      if (row.lifecycle !== 'issued') throw wrongState('Only an issued invoice takes a credit note.');
      const creditable = row.total_cents - row.credited_cents;
      if (input.amountCents > creditable) {
        const most = formatMoney(creditable, row.currency);
        throw badRequest(`A credit note can be at most what is still invoiced (${most}).`, { amountCents: `must be at most ${most}` });
      }
      const number = await takeNextNumber(ctx.models, transaction, row.apiary_id, 'credit-note');
      await CreditNote.create({ invoiceId: id, apiaryId: row.apiary_id, number, amountCents: input.amountCents, reason: input.reason, createdBy: user.id }, { transaction });
    });
    await publishInvoiceChange(ctx, id);
    return detail(user, id);
  }

  /** Signed agreements of the user's apiary with delivered colonies and no live invoice yet. */
  async function billableAgreements(user: InvoiceScope): Promise<BillableAgreementDto[]> {
    const rows = await selectBillableAgreements(ctx.sequelize, user.organizationId);
    return rows.map((r) => ({
      id: r.id, farm: { id: r.farm_id, name: r.farm_name }, colonies: r.colonies, coloniesDelivered: r.delivered,
      pricePerColonyCents: r.price_per_colony_cents, currency: r.currency, onSiteFrom: new Date(r.on_site_from).toISOString(),
    }));
  }

  return { list, detail, draft, updateDraft, discardDraft, issue, voidInvoice, addCreditNote, billableAgreements };
}

export type InvoicesService = ReturnType<typeof createInvoicesService>;
