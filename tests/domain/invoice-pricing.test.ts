// Invoice pricing worked examples, the arithmetic written beside each check.
// Terms follow the sample agreements in the trade (fee per colony, half at delivery, the
// balance within N days, 1% per month late interest): UF/IFAS EDIS "Sample Pollination
// Agreement" (2015). Strength sampling: Pennsylvania Dept. of Agriculture / Rutgers NJ
// (open a random sample of at least 10% of colonies, count frames of bees).
import { describe, it, expect } from 'vitest';
import {
  priceInvoice, startedMonthsOverdue, lateInterestCents, accruedInterestCents, invoiceStatus, type PricingTerms,
} from '../../shared/domain/invoice-pricing.js';

const zone = 'America/Los_Angeles';
// $65.00 per colony, half at delivery (UF/IFAS EDIS 2015), balance 30 days after pickup,
// 1% per month late interest (UF/IFAS EDIS 2015), below-minimum colonies not charged,
// minimum 6 frames of bees (Almond Board of California minimum; Delaplane & Mayer 2000 for apple).
const terms: PricingTerms = {
  pricePerColonyCents: 6500, depositShareBp: 5000, balanceDueDays: 30, belowMinimumRateBp: 0, extraMoveFeeCents: 0, minFramesOfBees: 6,
};
const delivered = new Date('2027-04-10T15:00:00Z'); // 08:00 PDT on 10 April
const pickedUp = new Date('2027-05-02T02:30:00Z'); // 19:30 PDT on 1 May (already 2 May in UTC)

describe('priceInvoice', () => {
  it('charges every colony at full strength', () => {
    const priced = priceInvoice({
      terms, taxRateBp: 0, timeZone: zone, extraMoves: 0,
      placements: [{ placementId: 'p1', coloniesDelivered: 40, deliveredAt: delivered, pickedUpAt: pickedUp, strengthCheck: { coloniesInGroup: 40, framesOfBees: [8, 7, 9, 6] } }],
    });
    // 40 colonies x $65.00 = $2,600.00; no sampled colony is under 6 frames (6 is not below 6).
    expect(priced.lines).toEqual([{ kind: 'colonies-full-rate', placementId: 'p1', quantity: 40, unitCents: 6500, amountCents: 260_000 }]);
    expect(priced.totalCents).toBe(260_000);
    // Half at delivery: $2,600.00 x 50% = $1,300.00; balance $2,600.00 - $1,300.00 = $1,300.00.
    expect(priced.depositCents).toBe(130_000);
    expect(priced.balanceCents).toBe(130_000);
  });

  it('charges colonies estimated below minimum at the agreed reduced share when the group falls short', () => {
    // Sample of 10 colonies (25% of a group of 40), 56 frames: average 5.6 < 6, so the group does not meet the
    // agreement (Rutgers NJ: shortfall not made up); 5 under 6 frames -> 5/10 x 40 = 20 colonies below minimum.
    const check = { coloniesInGroup: 40, framesOfBees: [8, 5, 7, 4, 3, 6, 5, 4, 6, 8] };
    const priced = priceInvoice({
      terms: { ...terms, belowMinimumRateBp: 5000, extraMoveFeeCents: 2500 }, taxRateBp: 0, timeZone: zone, extraMoves: 2,
      placements: [{ placementId: 'p1', coloniesDelivered: 40, deliveredAt: delivered, pickedUpAt: pickedUp, strengthCheck: check }],
    });
    // 20 x $65.00 = $1,300.00; 20 x ($65.00 x 50% = $32.50) = $650.00; 2 extra moves x $25.00 = $50.00.
    expect(priced.lines.map((l) => [l.kind, l.quantity, l.unitCents, l.amountCents])).toEqual([
      ['colonies-full-rate', 20, 6500, 130_000],
      ['colonies-below-minimum', 20, 3250, 65_000],
      ['extra-moves', 2, 2500, 5_000],
    ]);
    // $1,300.00 + $650.00 + $50.00 = $2,000.00
    expect(priced.subtotalCents).toBe(200_000);
  });

  it('does not charge below-minimum colonies when the share is 0 and rounds the estimate half up', () => {
    // 45 frames over 8 colonies: average 5.625 < 6. 4 of 8 sampled below: 4/8 x 21 = 10.5 -> 11 colonies (half up), charged 11 x $0.
    const check = { coloniesInGroup: 21, framesOfBees: [7, 7, 3, 3, 8, 5, 5, 7] };
    const priced = priceInvoice({ terms, taxRateBp: 0, timeZone: zone, extraMoves: 0, placements: [{ placementId: 'p', coloniesDelivered: 21, deliveredAt: delivered, pickedUpAt: null, strengthCheck: check }] });
    // 10 x $65.00 = $650.00; 11 x $0.00.
    expect(priced.lines[1]).toMatchObject({ kind: 'colonies-below-minimum', quantity: 11, amountCents: 0 });
    expect(priced.totalCents).toBe(65_000);
  });

  it('dates the deposit at delivery (a draft) and the balance N days after pickup, in the business time zone', () => {
    const priced = priceInvoice({ terms, taxRateBp: 0, timeZone: zone, extraMoves: 0, placements: [{ placementId: 'p', coloniesDelivered: 10, deliveredAt: delivered, pickedUpAt: pickedUp, strengthCheck: null }] });
    // Delivered 10 April (local); picked up 1 May 19:30 local -> 1 May + 30 days = 31 May.
    expect(priced.depositDueOn).toBe('2027-04-10');
    expect(priced.balanceDueOn).toBe('2027-05-31');
    const notPicked = priceInvoice({ terms, taxRateBp: 0, timeZone: zone, extraMoves: 0, placements: [{ placementId: 'p', coloniesDelivered: 10, deliveredAt: delivered, pickedUpAt: null, strengthCheck: null }] });
    expect(notPicked.balanceDueOn).toBeNull();
  });

  it('adds tax at the business rate on the subtotal', () => {
    // Common practice, no source: sales tax on the service subtotal. 40 x $65.00 = $2,600.00;
    // 7.25% (725 bp) of $2,600.00 = $188.50; total $2,788.50; deposit 50% = $1,394.25.
    const priced = priceInvoice({ terms, taxRateBp: 725, timeZone: zone, extraMoves: 0, placements: [{ placementId: 'p', coloniesDelivered: 40, deliveredAt: delivered, pickedUpAt: pickedUp, strengthCheck: null }] });
    expect(priced.taxCents).toBe(18_850);
    expect(priced.totalCents).toBe(278_850);
    expect(priced.depositCents).toBe(139_425);
    expect(priced.balanceCents).toBe(139_425);
  });
});

describe('late interest (simple, per started month)', () => {
  it('counts started months from the day after the due date', () => {
    expect(startedMonthsOverdue('2027-05-31', new Date('2027-05-31T23:00:00-07:00'), zone)).toBe(0);
    expect(startedMonthsOverdue('2027-05-31', new Date('2027-06-01T00:00:00-07:00'), zone)).toBe(1);
    expect(startedMonthsOverdue('2027-05-31', new Date('2027-07-31T12:00:00-07:00'), zone)).toBe(2);
    expect(startedMonthsOverdue('2027-05-31', new Date('2027-08-01T00:00:00-07:00'), zone)).toBe(3);
  });

  it('charges 1% per month on $1,300.00 overdue for 2 started months: $26.00', () => {
    // 1%/month: UF/IFAS EDIS Sample Pollination Agreement (2015). $1,300.00 x 1% x 2 = $26.00.
    expect(lateInterestCents(130_000, 100, 2)).toBe(2_600);
    const standing = { netTotalCents: 260_000, paidCents: 130_000, depositCents: 130_000, depositDueOn: '2027-04-10', balanceDueOn: '2027-05-31' };
    // Deposit paid; balance $1,300.00 due 31 May; on 15 July: June 1 .. July 1 is month 1, July 1 .. is month 2.
    expect(accruedInterestCents(standing, 100, new Date('2027-07-15T12:00:00-07:00'), zone)).toBe(2_600);
    expect(invoiceStatus('issued', standing, new Date('2027-07-15T12:00:00-07:00'), zone)).toBe('overdue');
    expect(invoiceStatus('issued', standing, new Date('2027-05-20T12:00:00-07:00'), zone)).toBe('partly-paid');
    expect(invoiceStatus('issued', { ...standing, paidCents: 260_000 }, new Date('2027-07-15T12:00:00-07:00'), zone)).toBe('paid');
    expect(invoiceStatus('issued', { ...standing, paidCents: 0 }, new Date('2027-04-10T12:00:00-07:00'), zone)).toBe('issued');
  });
});
