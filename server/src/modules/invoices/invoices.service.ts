// Invoices from agreements: draft from the confirmed placements (priced by
// shared/domain/invoice-pricing), review, issue with a gapless number, void while nothing
// is paid, correct by credit note. Issued invoices are never edited.
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import type { AppContext } from '../../context.js';
import { Invoice } from '../../db/models/invoice.model.js';
import { InvoiceLine } from '../../db/models/invoice-line.model.js';
import { CreditNote } from '../../db/models/credit-note.model.js';
import type {
  DraftInvoiceInput, UpdateDraftInput, VoidInvoiceInput, CreditNoteInput, InvoiceDto, InvoiceListQuery, InvoiceSummaryDto, BillableAgreementDto,
} from '../../../../shared/schemas/invoices.js';
import { notFound, wrongState, conflict, badRequest } from '../../errors/http-errors.js';
import { selectInvoices, toInvoiceSummary, formatCreditNoteNumber, type InvoiceRow } from './invoice-queries.js';
import { takeNextNumber } from './invoice-numbers.js';
import type { InvoiceScope } from './invoice-queries.js';
import { loadAgreement, priceAgreement, insertDraft, issueDraft } from './invoice-drafting.js';
import { queueNames } from '../../jobs/queue-names.js';

export function createInvoicesService(ctx: AppContext) {
  async function findRow(user: InvoiceScope, id: string): Promise<InvoiceRow> {
    const [row] = await selectInvoices(ctx, user, 'i.id = :id', { id });
    if (!row) throw notFound('That invoice');
    return row;
  }

  async function detail(user: InvoiceScope, id: string): Promise<InvoiceDto> {
    const row = await findRow(user, id);
    const [lines, creditNotes, payments, refunds] = await Promise.all([
      InvoiceLine.findAll({ where: { invoiceId: id }, order: [['position', 'ASC']] }),
      CreditNote.findAll({ where: { invoiceId: id }, order: [['number', 'ASC']] }),
      ctx.sequelize.query<{ id: string; method: 'online' | 'cheque' | 'bank-transfer'; state: 'pending' | 'succeeded' | 'failed'; amount_cents: number; refunded_cents: number; reference: string | null; failure_message: string | null; received_at: Date | null; created_at: Date }>(
        `SELECT p.id, p.method, p.state, p.amount_cents, p.reference, p.failure_message, p.received_at, p.created_at,
           coalesce((SELECT sum(r.amount_cents) FROM refunds r WHERE r.provider_payment_id = p.provider_payment_id AND r.state = 'succeeded'), 0)::int AS refunded_cents
         FROM payments p WHERE p.invoice_id = :id ORDER BY p.created_at, p.id`,
        { replacements: { id }, type: QueryTypes.SELECT },
      ),
      ctx.sequelize.query<{ id: string; state: 'pending' | 'succeeded' | 'failed'; amount_cents: number; reason: string | null; created_at: Date }>(
        'SELECT id, state, amount_cents, reason, created_at FROM refunds WHERE invoice_id = :id ORDER BY created_at, id',
        { replacements: { id }, type: QueryTypes.SELECT },
      ),
    ]);
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
        id: p.id, method: p.method, state: p.state, amountCents: p.amount_cents, refundedCents: p.refunded_cents, reference: p.reference,
        failureMessage: p.failure_message, receivedAt: p.received_at ? new Date(p.received_at).toISOString() : null, createdAt: new Date(p.created_at).toISOString(),
      })),
      refunds: refunds.map((r) => ({ id: r.id, state: r.state, amountCents: r.amount_cents, reason: r.reason, createdAt: new Date(r.created_at).toISOString() })),
    };
  }

  async function list(user: InvoiceScope, query: InvoiceListQuery): Promise<InvoiceSummaryDto[]> {
    const rows = await selectInvoices(ctx, user);
    const asOf = ctx.now();
    return rows
      .map((row) => toInvoiceSummary(row, asOf))
      .filter((s) => (!query.status || s.status === query.status) && (!query.season || s.season === query.season));
  }

  async function draft(user: InvoiceScope, input: DraftInvoiceInput): Promise<InvoiceDto> {
    const agreement = await loadAgreement(ctx.sequelize, user.organizationId, input.agreementId);
    let invoiceId: string;
    try {
      invoiceId = await ctx.sequelize.transaction((transaction) =>
        insertDraft(ctx.sequelize, agreement, { extraMoves: input.extraMoves, notes: input.notes, createdBy: user.id }, transaction));
    } catch (err) {
      if (err instanceof UniqueConstraintError) throw conflict('This agreement already has an invoice; void it before drafting another.', { agreementId: 'already invoiced' });
      throw err;
    }
    return detail(user, invoiceId);
  }

  /** Re-prices a draft from the current placements, with the given extra moves and notes. */
  async function updateDraft(user: InvoiceScope, id: string, input: UpdateDraftInput): Promise<InvoiceDto> {
    const row = await findRow(user, id);
    if (user.organizationKind !== 'apiary') throw notFound('That invoice');
    if (row.lifecycle !== 'draft') throw wrongState('An issued invoice cannot be changed; add a credit note to correct it.');
    const agreement = await loadAgreement(ctx.sequelize, user.organizationId, row.agreement_id);
    const extraMoves = input.extraMoves ?? row.extra_moves;
    const { priced, lines } = await priceAgreement(ctx.sequelize, agreement, extraMoves);
    await ctx.sequelize.transaction(async (transaction) => {
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
    await issueDraft(ctx.sequelize, id, user.organizationId, user.id, ctx.now());
    // The PDF and e-mail are made by a job, so issuing stays quick and survives a mail outage.
    await ctx.jobs.send(queueNames.invoiceEmail, { invoiceId: id });
    return detail(user, id);
  }

  async function voidInvoice(user: InvoiceScope, id: string, input: VoidInvoiceInput): Promise<InvoiceDto> {
    await ctx.sequelize.transaction(async (transaction) => {
      await ctx.sequelize.query('SELECT 1 FROM invoices WHERE id = :id AND apiary_id = :orgId FOR UPDATE', { replacements: { id, orgId: user.organizationId }, transaction });
      const [row] = await selectInvoices(ctx, user, 'i.id = :id', { id }, transaction);
      if (!row || user.organizationKind !== 'apiary') throw notFound('That invoice');
      if (row.lifecycle === 'draft') throw wrongState('A draft is discarded, not voided.');
      if (row.lifecycle === 'void') throw wrongState('This invoice is already void.');
      const [{ any_payment }] = await ctx.sequelize.query<{ any_payment: boolean }>(
        "SELECT EXISTS (SELECT 1 FROM payments WHERE invoice_id = :id AND state IN ('succeeded', 'pending')) AS any_payment",
        { replacements: { id }, type: QueryTypes.SELECT, transaction },
      );
      if (any_payment) throw wrongState('This invoice has payments; correct it with a credit note (and refund) instead of voiding it.');
      await Invoice.update({ lifecycle: 'void', voidedAt: ctx.now(), voidReason: input.reason }, { where: { id }, transaction });
    });
    return detail(user, id);
  }

  async function addCreditNote(user: InvoiceScope, id: string, input: CreditNoteInput): Promise<InvoiceDto> {
    await ctx.sequelize.transaction(async (transaction) => {
      await ctx.sequelize.query('SELECT 1 FROM invoices WHERE id = :id AND apiary_id = :orgId FOR UPDATE', { replacements: { id, orgId: user.organizationId }, transaction });
      const [row] = await selectInvoices(ctx, user, 'i.id = :id', { id }, transaction);
      if (!row) throw notFound('That invoice');
      if (row.lifecycle !== 'issued') throw wrongState('Only an issued invoice takes a credit note.');
      const creditable = row.total_cents - row.credited_cents;
      if (input.amountCents > creditable) throw badRequest(`A credit note can be at most what is still invoiced (${creditable} cents).`, { amountCents: `must be at most ${creditable}` });
      const number = await takeNextNumber(ctx.sequelize, transaction, row.apiary_id, 'credit-note');
      await CreditNote.create({ invoiceId: id, apiaryId: row.apiary_id, number, amountCents: input.amountCents, reason: input.reason, createdBy: user.id }, { transaction });
    });
    return detail(user, id);
  }

  /** Signed agreements of the user's apiary with delivered colonies and no live invoice yet. */
  async function billableAgreements(user: InvoiceScope): Promise<BillableAgreementDto[]> {
    const rows = await ctx.sequelize.query<{ id: string; farm_id: string; farm_name: string; colonies: number; delivered: number; price_per_colony_cents: number; currency: string; on_site_from: Date }>(
      `SELECT a.id, a.farm_id, f.name AS farm_name, a.colonies, a.price_per_colony_cents, trim(a.currency) AS currency, lower(a.expected_on_site) AS on_site_from,
         coalesce((SELECT sum(p.colonies_delivered) FROM placements p WHERE p.agreement_id = a.id AND p.state IN ('delivered', 'picked-up')), 0)::int AS delivered
       FROM agreements a JOIN organizations f ON f.id = a.farm_id
       WHERE a.apiary_id = :orgId AND a.state IN ('in-force', 'completed')
         AND NOT EXISTS (SELECT 1 FROM invoices i WHERE i.agreement_id = a.id AND i.lifecycle <> 'void')
       ORDER BY lower(a.expected_on_site), f.name`,
      { replacements: { orgId: user.organizationId }, type: QueryTypes.SELECT },
    );
    return rows.map((r) => ({
      id: r.id, farm: { id: r.farm_id, name: r.farm_name }, colonies: r.colonies, coloniesDelivered: r.delivered,
      pricePerColonyCents: r.price_per_colony_cents, currency: r.currency, onSiteFrom: new Date(r.on_site_from).toISOString(),
    }));
  }

  return { list, detail, draft, updateDraft, discardDraft, issue, voidInvoice, addCreditNote, billableAgreements };
}

export type InvoicesService = ReturnType<typeof createInvoicesService>;
