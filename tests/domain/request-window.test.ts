// When colonies must be on site. The bloom-stage model (flowers opening evenly from first
// bloom to full bloom) is common practice, no source; the move-in stages are sourced per
// crop in request-window.ts (apple: Delaplane & Mayer 2000; almond: Almond Board of
// California).
import { describe, it, expect } from 'vitest';
import { bloomStageDate, defaultArrivalBloomPercent, expectedOnSite, WindowError } from '../../shared/domain/request-window.js';

describe('bloomStageDate', () => {
  const window = { bloomStart: '2027-04-10', fullBloom: '2027-04-20', petalFall: '2027-04-30' };
  it('reaches 5% on the first day and 50% halfway to full bloom', () => {
    expect(bloomStageDate(window, 5)).toBe('2027-04-10');
    expect(bloomStageDate(window, 50)).toBe('2027-04-15');
    expect(bloomStageDate(window, 100)).toBe('2027-04-20');
  });
  it('takes full bloom as the midpoint of first bloom and petal fall when it is not known', () => {
    expect(bloomStageDate({ ...window, fullBloom: null }, 100)).toBe('2027-04-20');
  });
});

describe('defaultArrivalBloomPercent', () => {
  it('moves in at about 5% bloom for apple (Delaplane & Mayer 2000) and 10% for almond (Almond Board of California)', () => {
    expect(defaultArrivalBloomPercent('apple')).toBe(5);
    expect(defaultArrivalBloomPercent('almond')).toBe(10);
  });
});

describe('expectedOnSite', () => {
  it('runs from the arrival day to the end of petal fall day in the farm time zone, over all blocks', () => {
    const w = expectedOnSite({
      arrive: { rule: 'bloom-stage', bloomPercent: 5 },
      depart: { rule: 'petal-fall' },
      bloomWindows: [
        { bloomStart: '2027-04-12', fullBloom: '2027-04-20', petalFall: '2027-04-28' },
        { bloomStart: '2027-04-10', fullBloom: '2027-04-18', petalFall: '2027-04-26' },
      ],
      timeZone: 'America/Los_Angeles',
    });
    expect(w.from.toISOString()).toBe('2027-04-10T07:00:00.000Z'); // midnight PDT = 07:00 UTC
    expect(w.to.toISOString()).toBe('2027-04-29T07:00:00.000Z');
  });
  it('names the rule that needs a bloom window when none is published', () => {
    expect(() => expectedOnSite({ arrive: { rule: 'bloom-stage', bloomPercent: 5 }, depart: { rule: 'date', on: '2027-05-01' }, bloomWindows: [], timeZone: 'UTC' })).toThrow(WindowError);
  });
  it('refuses a departure before the arrival', () => {
    expect(() => expectedOnSite({ arrive: { rule: 'date', on: '2027-05-02' }, depart: { rule: 'date', on: '2027-04-01' }, bloomWindows: [], timeZone: 'UTC' })).toThrow(/after they arrive/);
  });
});
