// Invoice pricing: what a pollination agreement and its confirmed placements come to, in
// integer cents. Pure; used by the invoices service and shown the same way in the client.
//
// - Colonies delivered x price per colony. A checked group that does not meet the agreed
//   strength (its sample averages below the minimum frames of bees) has its estimated
//   share of colonies below the minimum charged at the agreement's reduced share (0 = not
//   charged); a group that meets it is charged in full. The rule and its clause wording
//   are one, in agreement-billing.ts. A sample is the usual way to check strength (at
//   least 10% of colonies, PA Dept. of Agriculture / Rutgers).
// - Extra moves at the agreed fee per move (agreement-billing.ts). Tax at the billing
//   business's rate on the subtotal.
// - Deposit: the agreed share of the total (colonies, extra moves and tax), as the fee
//   clause words it, due on the later of the first delivery day and the issue date plus the
//   agreement's days (agreement-billing.ts); balance due N days after the last pickup
//   (unknown until every delivered placement is picked up).
// - Late interest: SIMPLE interest per STARTED month on the amount overdue, from the day
//   after the due date. Agreements state the rate per month ("1% per month", UF/IFAS EDIS
//   Sample Pollination Agreement 2015), and a started month is how such a clause is read
//   and checked on paper; per-day accrual would bill fractions of a cent and differ from
//   the wording. No compounding.
// - Payments go to the deposit first, then the balance.
import { DateTime } from 'luxon';
import { coloniesAtReducedRate, depositDueOn, extraMovesAmountCents, type StrengthSample } from './agreement-billing.js';

export const invoiceStatuses = ['draft', 'issued', 'partly-paid', 'paid', 'overdue', 'void'] as const;
export type InvoiceStatus = (typeof invoiceStatuses)[number];

export interface PricingTerms {
  pricePerColonyCents: number;
  depositShareBp: number;
  balanceDueDays: number;
  belowMinimumRateBp: number;
  extraMoveFeeCents: number;
  minFramesOfBees: number;
}


export interface PlacementToPrice {
  placementId: string;
  coloniesDelivered: number;
  deliveredAt: Date | null;
  pickedUpAt: Date | null;
  strengthCheck: StrengthSample | null;
}

export type PricedLineKind = 'colonies-full-rate' | 'colonies-below-minimum' | 'extra-moves';

export interface PricedLine {
  kind: PricedLineKind;
  placementId: string | null;
  quantity: number;
  unitCents: number;
  amountCents: number;
}

export interface PricedInvoice {
  lines: PricedLine[];
  subtotalCents: number;
  taxRateBp: number;
  taxCents: number;
  totalCents: number;
  depositCents: number;
  balanceCents: number;
  /** ISO dates in the billing business's time zone. */
  depositDueOn: string | null;
  balanceDueOn: string | null;
}

/** amount x basis points / 10,000, rounded half up to the cent (amounts are never negative). */
export function applyBasisPoints(amountCents: number, bp: number): number {
  return Math.round((amountCents * bp) / 10_000);
}

function localDate(at: Date, timeZone: string): DateTime {
  return DateTime.fromJSDate(at, { zone: timeZone }).startOf('day');
}

export function priceInvoice(input: {
  terms: PricingTerms;
  placements: PlacementToPrice[];
  extraMoves: number;
  taxRateBp: number;
  timeZone: string;
  /** When the invoice is (or was) issued; a draft has none yet, and its deposit is shown due on the delivery day. */
  issuedAt?: Date | null;
}): PricedInvoice {
  const { terms } = input;
  const lines: PricedLine[] = [];
  const belowUnit = applyBasisPoints(terms.pricePerColonyCents, terms.belowMinimumRateBp);
  for (const p of input.placements) {
    const below = coloniesAtReducedRate(p.strengthCheck, terms.minFramesOfBees, p.coloniesDelivered);
    const full = p.coloniesDelivered - below;
    lines.push({ kind: 'colonies-full-rate', placementId: p.placementId, quantity: full, unitCents: terms.pricePerColonyCents, amountCents: full * terms.pricePerColonyCents });
    if (below > 0) lines.push({ kind: 'colonies-below-minimum', placementId: p.placementId, quantity: below, unitCents: belowUnit, amountCents: below * belowUnit });
  }
  if (input.extraMoves > 0) {
    lines.push({ kind: 'extra-moves', placementId: null, quantity: input.extraMoves, unitCents: terms.extraMoveFeeCents, amountCents: extraMovesAmountCents(input.extraMoves, terms.extraMoveFeeCents) });
  }
  const subtotalCents = lines.reduce((sum, l) => sum + l.amountCents, 0);
  const taxCents = applyBasisPoints(subtotalCents, input.taxRateBp);
  const totalCents = subtotalCents + taxCents;
  const depositCents = applyBasisPoints(totalCents, terms.depositShareBp);

  const delivered = input.placements.filter((p) => p.deliveredAt);
  const firstDelivery = delivered.map((p) => p.deliveredAt!.getTime()).sort((a, b) => a - b)[0];
  const allPickedUp = delivered.length > 0 && delivered.every((p) => p.pickedUpAt);
  const lastPickup = allPickedUp ? Math.max(...delivered.map((p) => p.pickedUpAt!.getTime())) : null;
  return {
    lines,
    subtotalCents,
    taxRateBp: input.taxRateBp,
    taxCents,
    totalCents,
    depositCents,
    balanceCents: totalCents - depositCents,
    depositDueOn: firstDelivery === undefined ? null : depositDueOn(
      localDate(new Date(firstDelivery), input.timeZone).toISODate()!,
      input.issuedAt ? localDate(input.issuedAt, input.timeZone).toISODate() : null,
      terms.balanceDueDays,
    ),
    balanceDueOn: lastPickup === null ? null : localDate(new Date(lastPickup), input.timeZone).plus({ days: terms.balanceDueDays }).toISODate(),
  };
}

/** Months started since a due date passed: 0 on or before the due date, 1 from the next day, 2 a month after that ... */
export function startedMonthsOverdue(dueOn: string, asOf: Date, timeZone: string): number {
  const overdueFrom = DateTime.fromISO(dueOn, { zone: timeZone }).plus({ days: 1 }).startOf('day');
  const now = DateTime.fromJSDate(asOf, { zone: timeZone });
  if (now < overdueFrom) return 0;
  return Math.floor(now.diff(overdueFrom, 'months').months) + 1;
}

export function lateInterestCents(overdueCents: number, bpPerMonth: number, startedMonths: number): number {
  return Math.round((overdueCents * bpPerMonth * startedMonths) / 10_000);
}

export interface InvoiceStanding {
  /** Total after credit notes. */
  netTotalCents: number;
  paidCents: number;
  depositCents: number;
  depositDueOn: string | null;
  balanceDueOn: string | null;
}

/** The amounts past their due date as of a moment, deposit first (payments cover the deposit first). */
export function overdueAmounts(s: InvoiceStanding, asOf: Date, timeZone: string) {
  const deposit = Math.min(s.depositCents, s.netTotalCents);
  const balance = s.netTotalCents - deposit;
  const depositOpen = Math.max(0, deposit - s.paidCents);
  const balanceOpen = Math.max(0, balance - Math.max(0, s.paidCents - deposit));
  const depositMonths = s.depositDueOn ? startedMonthsOverdue(s.depositDueOn, asOf, timeZone) : 0;
  const balanceMonths = s.balanceDueOn ? startedMonthsOverdue(s.balanceDueOn, asOf, timeZone) : 0;
  return {
    deposit: depositMonths > 0 ? { cents: depositOpen, startedMonths: depositMonths } : null,
    balance: balanceMonths > 0 ? { cents: balanceOpen, startedMonths: balanceMonths } : null,
  };
}

export function accruedInterestCents(s: InvoiceStanding, bpPerMonth: number, asOf: Date, timeZone: string): number {
  const o = overdueAmounts(s, asOf, timeZone);
  return (o.deposit ? lateInterestCents(o.deposit.cents, bpPerMonth, o.deposit.startedMonths) : 0)
    + (o.balance ? lateInterestCents(o.balance.cents, bpPerMonth, o.balance.startedMonths) : 0);
}

/** The state a person sees: the stored lifecycle (draft, issued, void) refined by money and the date. */
export function invoiceStatus(lifecycle: 'draft' | 'issued' | 'void', s: InvoiceStanding, asOf: Date, timeZone: string): InvoiceStatus {
  if (lifecycle !== 'issued') return lifecycle;
  if (s.paidCents >= s.netTotalCents) return 'paid';
  const o = overdueAmounts(s, asOf, timeZone);
  if ((o.deposit && o.deposit.cents > 0) || (o.balance && o.balance.cents > 0)) return 'overdue';
  return s.paidCents > 0 ? 'partly-paid' : 'issued';
}
