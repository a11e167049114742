// What the money looks like from each side: the beekeeper's receivables (by grower, by
// status, season totals, expected vs received by week) and the grower's payables with the
// pollination cost per acre of each block; CSV exports of invoices and payments.
import { DateTime } from 'luxon';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import type { InvoiceSummaryDto, PayablesDto, ReceivablesDto } from '../../../../shared/schemas/invoices.js';
import { selectInvoices, selectMoneyMovements, selectBlockCharges } from './invoices.queries.js';
import { toInvoiceSummary, formatInvoiceNumber, refundedByPayment, refundedOf } from './invoice-summary.js';
import { toCsv } from './csv.js';
import { labelOf } from '../../../../shared/labels/label-set.js';
import { invoiceStatusSet, paymentMethodSet, paymentStateSet } from '../../../../shared/labels/invoices.js';

const SQUARE_METRES_PER_ACRE = 4046.8564224;
const live = (s: InvoiceSummaryDto) => s.status !== 'draft' && s.status !== 'void';

function weekStart(at: DateTime): string {
  return at.startOf('week').toISODate()!;
}

export function createInvoiceReportsService(ctx: AppContext) {
  const { Organization, Payment, Refund, Invoice } = ctx.models;

  async function liveSummaries(user: AuthUser, season?: number) {
    const asOf = ctx.now();
    const all = (await selectInvoices(ctx.sequelize, user)).map((row) => toInvoiceSummary(row, asOf));
    const seasons = [...new Set(all.map((s) => s.season))].sort();
    const chosen = season ?? seasons.at(-1) ?? DateTime.fromJSDate(asOf).year;
    return { summaries: all.filter((s) => live(s) && s.season === chosen), season: chosen };
  }

  function totalsOf(summaries: InvoiceSummaryDto[]) {
    return {
      invoicedCents: summaries.reduce((n, s) => n + s.netTotalCents, 0),
      receivedCents: summaries.reduce((n, s) => n + s.paidCents, 0),
      outstandingCents: summaries.reduce((n, s) => n + s.outstandingCents, 0),
      overdueCents: summaries.filter((s) => s.status === 'overdue').reduce((n, s) => n + s.outstandingCents, 0),
    };
  }

  async function receivables(user: AuthUser, seasonWanted?: number): Promise<ReceivablesDto & { season: number }> {
    const { summaries, season } = await liveSummaries(user, seasonWanted);
    const org = await Organization.findByPk(user.organizationId!, { attributes: ['timeZone', 'currency'], rejectOnEmpty: true });
    const zone = org.timeZone;
    const byGrower = new Map<string, ReceivablesDto['byGrower'][number]>();
    const byStatus = new Map<string, ReceivablesDto['byStatus'][number]>();
    const weeks = new Map<string, { expectedCents: number; receivedCents: number }>();
    const week = (key: string) => weeks.get(key) ?? (weeks.set(key, { expectedCents: 0, receivedCents: 0 }), weeks.get(key)!);
    for (const s of summaries) {
      const g = byGrower.get(s.farm.id) ?? { farmId: s.farm.id, farmName: s.farm.name, invoices: 0, netTotalCents: 0, paidCents: 0, outstandingCents: 0 };
      g.invoices += 1; g.netTotalCents += s.netTotalCents; g.paidCents += s.paidCents; g.outstandingCents += s.outstandingCents;
      byGrower.set(s.farm.id, g);
      const st = byStatus.get(s.status) ?? { status: s.status, invoices: 0, outstandingCents: 0 };
      st.invoices += 1; st.outstandingCents += s.outstandingCents;
      byStatus.set(s.status, st);
      const deposit = Math.min(s.depositCents, s.netTotalCents);
      if (s.depositDueOn) week(weekStart(DateTime.fromISO(s.depositDueOn, { zone }))).expectedCents += deposit;
      if (s.balanceDueOn) week(weekStart(DateTime.fromISO(s.balanceDueOn, { zone }))).expectedCents += s.netTotalCents - deposit;
    }
    if (summaries.length > 0) {
      const money = await selectMoneyMovements(ctx.sequelize, summaries.map((s) => s.id));
      for (const m of money) week(weekStart(DateTime.fromJSDate(new Date(m.at), { zone }))).receivedCents += m.cents;
    }
    return {
      season,
      currency: summaries[0]?.currency ?? org.currency.trim(),
      seasonTotals: totalsOf(summaries),
      byGrower: [...byGrower.values()].sort((a, b) => b.outstandingCents - a.outstandingCents || a.farmName.localeCompare(b.farmName)),
      byStatus: [...byStatus.values()],
      weekly: [...weeks.entries()].sort(([a], [b]) => a.localeCompare(b)).map(([weekStartOn, w]) => ({ weekStart: weekStartOn, ...w })),
    };
  }

  async function payables(user: AuthUser, seasonWanted?: number): Promise<PayablesDto & { season: number }> {
    const { summaries, season } = await liveSummaries(user, seasonWanted);
    const blocks = new Map<string, PayablesDto['blocks'][number]>();
    if (summaries.length > 0) {
      const rows = await selectBlockCharges(ctx.sequelize, summaries.map((s) => s.id));
      // Each invoice's net total (tax, extra moves and credits included) is shared among its
      // blocks in proportion to what their colonies were charged.
      for (const s of summaries) {
        const mine = rows.filter((r) => r.invoice_id === s.id);
        const charged = mine.reduce((n, r) => n + r.charged_cents, 0);
        for (const r of mine) {
          const b = blocks.get(r.block_id) ?? { blockId: r.block_id, blockName: r.block_name, acres: r.area_m2 / SQUARE_METRES_PER_ACRE, colonies: 0, costCents: 0, costPerAcreCents: 0 };
          b.colonies += r.colonies;
          b.costCents += charged > 0 ? Math.round((s.netTotalCents * r.charged_cents) / charged) : 0;
          blocks.set(r.block_id, b);
        }
      }
    }
    for (const b of blocks.values()) b.costPerAcreCents = Math.round(b.costCents / b.acres);
    return {
      season,
      currency: summaries[0]?.currency ?? 'USD',
      totals: (({ invoicedCents, receivedCents, outstandingCents, overdueCents }) => ({ invoicedCents, paidCents: receivedCents, outstandingCents, overdueCents }))(totalsOf(summaries)),
      blocks: [...blocks.values()].sort((a, b) => a.blockName.localeCompare(b.blockName)),
    };
  }

  const decimal = (cents: number) => (cents / 100).toFixed(2);

  async function invoicesCsv(user: AuthUser): Promise<string> {
    const asOf = ctx.now();
    const rows = (await selectInvoices(ctx.sequelize, user)).map((r) => toInvoiceSummary(r, asOf));
    return toCsv(
      ['number', 'status', 'season', 'grower', 'beekeeper', 'currency', 'total', 'credited', 'net_total', 'paid', 'outstanding', 'deposit', 'deposit_due_on', 'balance_due_on', 'late_interest_accrued', 'issued_at'],
      rows.map((s) => [s.number ?? '', labelOf(invoiceStatusSet, s.status), s.season, s.farm.name, s.apiary.name, s.currency, decimal(s.totalCents), decimal(s.creditedCents), decimal(s.netTotalCents),
        decimal(s.paidCents), decimal(s.outstandingCents), decimal(s.depositCents), s.depositDueOn ?? '', s.balanceDueOn ?? '', decimal(s.accruedInterestCents), s.issuedAt ?? '']),
    );
  }

  async function paymentsCsv(user: AuthUser): Promise<string> {
    const header = ['invoice', 'grower', 'method', 'state', 'currency', 'amount', 'refunded', 'reference', 'received_at'];
    const visible = await selectInvoices(ctx.sequelize, user, { issuedOrVoidOnly: true });
    if (visible.length === 0) return toCsv(header, []);
    const ids = visible.map((v) => v.id);
    const [payments, refunds] = await Promise.all([
      Payment.findAll({
        where: { invoiceId: ids },
        include: [{ model: Invoice, as: 'invoice', attributes: ['number'], include: [{ model: Organization, as: 'farm', attributes: ['name'] }] }],
      }),
      Refund.findAll({ where: { invoiceId: ids }, attributes: ['providerPaymentId', 'state', 'amountCents'] }),
    ]);
    const refunded = refundedByPayment(refunds);
    const at = (p: (typeof payments)[number]) => p.receivedAt ?? p.createdAt;
    payments.sort((a, b) => at(a).getTime() - at(b).getTime() || a.id.localeCompare(b.id));
    return toCsv(header, payments.map((p) => {
      const invoice = p.get('invoice') as { number: number | null; farm: { name: string } };
      return [formatInvoiceNumber(invoice.number) ?? '', invoice.farm.name, labelOf(paymentMethodSet, p.method), labelOf(paymentStateSet, p.state), p.currency.trim(), decimal(p.amountCents), decimal(refundedOf(p, refunded)),
        p.reference ?? '', at(p).toISOString()];
    }));
  }

  return { receivables, payables, invoicesCsv, paymentsCsv };
}

export type InvoiceReportsService = ReturnType<typeof createInvoiceReportsService>;
