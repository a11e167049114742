// The agreement's own words price the invoice: strength shortfall, extra moves, the deposit
// share and its due date are each one rule, stated in the clause and applied by the invoice.
import { describe, it, expect } from 'vitest';
import { agreementClauses, type ClauseTerms } from '../../shared/domain/agreement-clauses.js';
import { coloniesAtReducedRate, depositDueOn, groupMeetsStrength, reducedRateWording } from '../../shared/domain/agreement-billing.js';
import { priceInvoice } from '../../shared/domain/invoice-pricing.js';

const zone = 'America/Los_Angeles';
// $65.00 a colony, half at delivery, 30 days (UF/IFAS EDIS "Sample Pollination Agreement" 2015); 6 frames of
// bees minimum (Delaplane & Mayer 2000, apple); 50% for short colonies and $25.00 a move: example terms.
const terms: ClauseTerms = {
  colonies: 40, minFramesOfBees: 6, minFramesOfBrood: null, pricePerColonyCents: 6500, currency: 'USD', depositShareBp: 5000,
  balanceDueDays: 30, lateInterestBpPerMonth: 100, belowMinimumRateBp: 5000, extraMoveFeeCents: 2500, noticeHours: 48, removalNoticeHours: 48,
};
const clause = (key: string) => agreementClauses(terms).find((c) => c.key === key)!.text;
const delivered = new Date('2027-04-10T15:00:00Z'); // 08:00 PDT on 10 April

/** Reads the strength terms back out of the clause text, so the test prices what the agreement says. */
function termsFromShortfallClause(text: string) {
  const minimum = Number(/averages fewer than (\d+(?:\.\d+)?) frames of bees does not/.exec(text)![1]);
  const rate = /is paid at (\d+(?:\.\d+)?)% of the fee|is not charged/.exec(text)!;
  return { minFramesOfBees: minimum, belowMinimumRateBp: rate[1] === undefined ? 0 : Number(rate[1]) * 100 };
}

const price = (framesOfBees: number[], extraMoves = 0, issuedAt: Date | null = null) => priceInvoice({
  terms: { ...terms, ...termsFromShortfallClause(clause('below-minimum')), extraMoveFeeCents: Number(/costs (\d+\.\d\d) USD per move/.exec(clause('extra-moves'))![1]) * 100 },
  taxRateBp: 0, timeZone: zone, extraMoves, issuedAt,
  placements: [{ placementId: 'p', coloniesDelivered: 40, deliveredAt: delivered, pickedUpAt: null, strengthCheck: { coloniesInGroup: 40, framesOfBees } }],
});

describe('strength shortfall: the clause and the invoice', () => {
  it('says a group meets the agreement on its sample average, and the strength check says the same', () => {
    expect(clause('below-minimum')).toMatch(/sample averages at least 6 frames of bees meets the agreed strength and is paid in full/);
    expect(clause('inspection')).toMatch(/the group meets this agreement when the shortfall is made up/);
  });

  it('charges nothing reduced for frames [4, 8, 8, 8] at a minimum of 6: the group passes on average', () => {
    // Rutgers NJ recommendations: a group passes when its weak colonies are offset by strong ones. 28 frames / 4 = 7 >= 6.
    expect(groupMeetsStrength({ coloniesInGroup: 40, framesOfBees: [4, 8, 8, 8] }, 6)).toBe(true);
    const priced = price([4, 8, 8, 8]);
    expect(priced.lines).toEqual([{ kind: 'colonies-full-rate', placementId: 'p', quantity: 40, unitCents: 6500, amountCents: 260_000 }]);
  });

  it('charges the short share of a group that fails at the clause\'s rate', () => {
    // [4, 4, 6, 8]: 22 frames / 4 = 5.5 < 6, fails; 2 of 4 below 6 -> 2/4 x 40 = 20 colonies at 50% of $65.00 = $32.50.
    const priced = price([4, 4, 6, 8]);
    expect(priced.lines.map((l) => [l.kind, l.quantity, l.unitCents])).toEqual([['colonies-full-rate', 20, 6500], ['colonies-below-minimum', 20, 3250]]);
    // Exactly at the minimum on average passes (common practice, no source: "at least" includes the value).
    expect(coloniesAtReducedRate({ coloniesInGroup: 40, framesOfBees: [5, 7] }, 6, 40)).toBe(0);
  });
});

describe('strength shortfall at a reduced rate of 0: the clause and the invoice', () => {
  // The request form's default rate for colonies below the minimum is 0: the invoice then charges a failing
  // group's short share nothing, so the agreement states that too (common practice, no source: the clause
  // says what the invoice does, worked from the same Rutgers NJ group rule as above).
  const free = { ...terms, belowMinimumRateBp: 0 };
  const text = agreementClauses(free).find((c) => c.key === 'below-minimum')?.text ?? '';

  it('keeps the shortfall clause and says short colonies of a failing group are not charged', () => {
    expect(text).toMatch(/averages fewer than 6 frames of bees does not: .* is not charged\.$/);
  });

  it('prices the clause\'s own wording: [4, 4, 6, 8] fails, 20 of 40 colonies charged nothing', () => {
    // 22 frames / 4 = 5.5 < 6, fails; 2 of 4 below 6 -> 2/4 x 40 = 20 colonies not charged; 20 x $65.00 = $1,300.00.
    const priced = priceInvoice({
      terms: { ...free, ...termsFromShortfallClause(text) }, taxRateBp: 0, timeZone: zone, extraMoves: 0,
      placements: [{ placementId: 'p', coloniesDelivered: 40, deliveredAt: delivered, pickedUpAt: null, strengthCheck: { coloniesInGroup: 40, framesOfBees: [4, 4, 6, 8] } }],
    });
    expect(priced.lines.map((l) => [l.kind, l.quantity, l.unitCents])).toEqual([['colonies-full-rate', 20, 6500], ['colonies-below-minimum', 20, 0]]);
    expect(priced.totalCents).toBe(130_000);
  });
});

describe('short colonies: one wording for the clause and the invoice line', () => {
  it('says "paid at 50% of the fee" or "not charged" in both, as the rate is', () => {
    // Common practice, no source: the agreement and the invoice line must read the same (the rate is example terms).
    expect(reducedRateWording(5000)).toBe('paid at 50% of the fee');
    expect(reducedRateWording(0)).toBe('not charged');
    expect(clause('below-minimum')).toContain(`is ${reducedRateWording(5000)}.`);
    expect(agreementClauses({ ...terms, belowMinimumRateBp: 0 }).find((c) => c.key === 'below-minimum')!.text).toContain(`is ${reducedRateWording(0)}.`);
  });
});

describe('extra moves: the clause and the invoice', () => {
  it('bills per move, as the clause words it', () => {
    expect(clause('extra-moves')).toBe('Each move the grower asks for beyond delivery and pickup costs 25.00 USD per move, whatever the number of colonies moved.');
    // 3 moves x $25.00 = $75.00, however many of the 40 colonies each move takes.
    expect(price([8, 8, 8, 8], 3).lines.at(-1)).toEqual({ kind: 'extra-moves', placementId: null, quantity: 3, unitCents: 2500, amountCents: 7_500 });
  });
});

describe('deposit share: the clause and the invoice', () => {
  it('says the deposit is a share of the invoice total, and the invoice takes that share of the total', () => {
    // Half at delivery, the balance later (UF/IFAS EDIS "Sample Pollination Agreement" 2015): two payments that add
    // up to the bill. 7.25% tax is an example rate. 40 x $65.00 = $2,600.00, 3 moves x $25.00 = $75.00,
    // subtotal $2,675.00, tax $193.94 (193.9375 half up), total $2,868.94, deposit 50% = $1,434.47.
    const share = /(\d+(?:\.\d+)?)% of the invoice total \(colonies, extra moves and tax\) is due/.exec(clause('fee'));
    expect(share).not.toBeNull();
    const priced = priceInvoice({
      terms: { ...terms, depositShareBp: Number(share![1]) * 100 }, taxRateBp: 725, timeZone: zone, extraMoves: 3,
      placements: [{ placementId: 'p', coloniesDelivered: 40, deliveredAt: delivered, pickedUpAt: null, strengthCheck: null }],
    });
    expect(priced.totalCents).toBe(286_894);
    expect(priced.depositCents).toBe(143_447);
    expect(priced.balanceCents).toBe(143_447);
  });
});

describe('deposit due date: the clause and the invoice', () => {
  it('says the deposit is due at the first delivery or the issue date plus the agreement\'s days, whichever is later', () => {
    expect(clause('fee')).toMatch(/is due on the day of the first delivery, or 30 days after the invoice is issued if that is later/);
  });

  it('is the delivery day for an invoice issued well before it, and issue day + 30 for one issued after', () => {
    // Common practice, no source: the clause's own rule, read as written.
    expect(depositDueOn('2027-04-10', '2027-03-01', 30)).toBe('2027-04-10'); // 1 March + 30 = 31 March, before delivery
    expect(depositDueOn('2027-04-10', '2027-04-20', 30)).toBe('2027-05-20');
    // Issued 20 April at 17:00 PDT (already 21 April in UTC): the business's local day counts.
    expect(price([8, 8, 8, 8], 0, new Date('2027-04-21T00:00:00Z')).depositDueOn).toBe('2027-05-20');
    expect(price([8, 8, 8, 8]).depositDueOn).toBe('2027-04-10'); // a draft: not issued yet
  });
});
