// Codling moth biofix and egg hatch timing.
import { describe, it, expect } from 'vitest';
import { findBiofix, pestTiming, codlingMoth } from '../../shared/domain/pest-timing.js';

describe('findBiofix', () => {
  // Source: MSU Enviroweather codling moth model; Jones, Doerr & Brunner 2008 (WSU): biofix = first moth on two successive checks.
  it('sets the biofix at the first of two successive checks with a catch, ignoring a lone catch', () => {
    const checks = [
      { day: '2027-05-01', moths: 0 }, { day: '2027-05-03', moths: 2 }, { day: '2027-05-05', moths: 0 },
      { day: '2027-05-07', moths: 1 }, { day: '2027-05-09', moths: 4 },
    ];
    expect(findBiofix(checks)).toBe('2027-05-07');
    expect(findBiofix(checks.slice(0, 3))).toBeNull();
  });
});

describe('pestTiming', () => {
  it('uses 50/88 °F thresholds and reaches first egg hatch at 250 DD°F after the biofix', () => {
    expect(codlingMoth).toMatchObject({ lowerThresholdF: 50, upperThresholdF: 88 });
    // Days with Tmin 60 °F, Tmax 80 °F lie wholly above 50 and below 88: 20 DD°F each (mean − threshold;
    // UC IPM degree-day methods, Zalom et al. 1983). 250 DD is passed on day 13 (13 x 20 = 260).
    const days = Array.from({ length: 20 }, (_, i) => ({ day: `2027-05-${String(7 + i).padStart(2, '0')}`, tmin: 60, tmax: 80 }));
    const timing = pestTiming(codlingMoth, [{ day: '2027-05-07', moths: 1 }, { day: '2027-05-09', moths: 3 }], days);
    expect(timing.biofix).toBe('2027-05-07');
    expect(timing.stages[0]).toEqual({ name: 'First egg hatch', degreeDaysF: 250, reachedOn: '2027-05-19' });
    expect(timing.stages[1].reachedOn).toBe('2027-05-24'); // 18 x 20 = 360 >= 350
    expect(timing.degreeDaysF).toBeCloseTo(400, 6);
  });

  it('cuts heat above 88 °F horizontally (a day of 88–100 °F counts 38 DD°F)', () => {
    const timing = pestTiming(codlingMoth, [{ day: '2027-07-01', moths: 1 }, { day: '2027-07-02', moths: 1 }], [{ day: '2027-07-01', tmin: 88, tmax: 100 }]);
    expect(timing.degreeDaysF).toBeCloseTo(38, 6);
  });

  it('gives no timing before a biofix', () => {
    expect(pestTiming(codlingMoth, [{ day: '2027-05-01', moths: 1 }], []).stages.every((s) => s.reachedOn === null)).toBe(true);
  });
});
