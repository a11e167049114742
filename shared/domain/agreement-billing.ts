// The billing rules an agreement states and its invoices apply, each written once: the
// clause wording and the computation side by side, so the agreement and the invoice cannot
// say different things.
// - Strength shortfall: a checked group meets the agreement when its sample averages at
//   least the minimum frames of bees (the frames its weak colonies lack are made up by its
//   strong ones; Rutgers NJ recommendations). Only a group that does not meet
//   it is paid at the reduced rate, for its estimated share of colonies below the minimum
//   (the sampled share applied to the group, half up, never more than were delivered);
//   at a reduced rate of 0 those colonies are not charged, and the clause says so.
// - Extra moves: a fee per move the grower asks for, whatever the number of colonies moved.
// - Deposit: the agreed share of the invoice total (colonies, extra moves and tax), not of
//   the colonies' fee alone: "half at delivery, balance within N days" (UF/IFAS EDIS Sample
//   Pollination Agreement 2015) splits the bill into two payments that add up to it, which is
//   how growers pay it. Due on the later of the first delivery day and the invoice's issue
//   date plus the agreement's payment days, so an invoice is never overdue on the day it is
//   issued.
import { DateTime } from 'luxon';

export interface StrengthSample {
  coloniesInGroup: number;
  framesOfBees: number[];
}

const money = (cents: number, currency: string) => `${(cents / 100).toFixed(2)} ${currency}`;
const percent = (bp: number) => `${(bp / 100).toLocaleString('en-US', { maximumFractionDigits: 2 })}%`;

/** True when the sample averages at least the minimum frames of bees. */
export function groupMeetsStrength(check: StrengthSample, minFramesOfBees: number): boolean {
  const total = check.framesOfBees.reduce((sum, f) => sum + f, 0);
  // Compare totals, not a rounded average: 4 + 8 + 8 + 8 = 28 frames against 4 x 6 = 24.
  return total >= minFramesOfBees * check.framesOfBees.length - 1e-9;
}

/** Colonies of a checked group paid at the reduced rate: none when the group meets the agreement. */
export function coloniesAtReducedRate(check: StrengthSample | null, minFramesOfBees: number, coloniesDelivered: number): number {
  if (!check || check.framesOfBees.length === 0 || groupMeetsStrength(check, minFramesOfBees)) return 0;
  const below = check.framesOfBees.filter((frames) => frames < minFramesOfBees).length;
  return Math.min(Math.round((below / check.framesOfBees.length) * check.coloniesInGroup), coloniesDelivered);
}

/** What short colonies of a failing group are charged, in the words both the clause and the invoice line use. */
export function reducedRateWording(belowMinimumRateBp: number): string {
  return belowMinimumRateBp > 0 ? `paid at ${percent(belowMinimumRateBp)} of the fee` : 'not charged';
}

export function shortfallClauseText(t: { minFramesOfBees: number; belowMinimumRateBp: number }): string {
  return `A checked group whose sample averages at least ${t.minFramesOfBees} frames of bees meets the agreed strength and is paid in full, `
    + `even if some colonies in it are below ${t.minFramesOfBees} frames. A group whose sample averages fewer than ${t.minFramesOfBees} frames of bees does not: `
    + `the share of its sampled colonies below ${t.minFramesOfBees} frames, applied to the colonies in the group and rounded to the nearest colony, `
    + `is ${reducedRateWording(t.belowMinimumRateBp)}.`;
}

export function extraMovesAmountCents(moves: number, feeCents: number): number {
  if (!Number.isInteger(moves) || moves < 0) throw new RangeError('extra moves must be a whole number of zero or more');
  return moves * feeCents;
}

export function extraMovesClauseText(t: { extraMoveFeeCents: number; currency: string }): string {
  return t.extraMoveFeeCents > 0
    ? `Each move the grower asks for beyond delivery and pickup costs ${money(t.extraMoveFeeCents, t.currency)} per move, whatever the number of colonies moved.`
    : 'Moves the grower asks for beyond delivery and pickup are agreed and priced between the two sides before they are made.';
}

/** The deposit's due day (YYYY-MM-DD): the later of the first delivery day and the issue day plus the agreement's days. */
export function depositDueOn(firstDeliveryDay: string, issuedOn: string | null, paymentDays: number): string {
  if (!issuedOn) return firstDeliveryDay;
  const fromIssue = DateTime.fromISO(issuedOn, { zone: 'utc' }).plus({ days: paymentDays }).toISODate()!;
  return fromIssue > firstDeliveryDay ? fromIssue : firstDeliveryDay;
}

export function feeClauseText(t: { pricePerColonyCents: number; currency: string; depositShareBp: number; balanceDueDays: number; lateInterestBpPerMonth: number }): string {
  return `The fee is ${money(t.pricePerColonyCents, t.currency)} per colony set down. ${percent(t.depositShareBp)} of the invoice total (colonies, extra moves and tax) is due on the day of the first delivery, `
    + `or ${t.balanceDueDays} days after the invoice is issued if that is later; the balance is due within ${t.balanceDueDays} days of pickup. `
    + `Unpaid amounts carry interest of ${percent(t.lateInterestBpPerMonth)} per month after their due date.`;
}
