// Codling moth biofix and egg hatch timing.
import { describe, it, expect } from 'vitest';
import { findBiofix, pestTiming, codlingMoth, seasonOf } from '../../shared/domain/pest-timing.js';
import { suggestCoverSprayDays, sprayWindowCaution } from '../../shared/domain/spray-windows.js';

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
    const timing = pestTiming(codlingMoth, [{ day: '2027-05-07', moths: 1 }, { day: '2027-05-09', moths: 3 }], days, 2027);
    expect(timing.biofix).toBe('2027-05-07');
    expect(timing.stages[0]).toEqual({ name: 'First egg hatch', degreeDaysF: 250, reachedOn: '2027-05-19', estimated: false });
    expect(timing.stages[1].reachedOn).toBe('2027-05-24'); // 18 x 20 = 360 >= 350
    expect(timing.degreeDaysF).toBeCloseTo(400, 6);
  });

  it('cuts heat above 88 °F horizontally (a day of 88–100 °F counts 38 DD°F)', () => {
    const timing = pestTiming(codlingMoth, [{ day: '2027-07-01', moths: 1 }, { day: '2027-07-02', moths: 1 }], [{ day: '2027-07-01', tmin: 88, tmax: 100 }], 2027);
    expect(timing.degreeDaysF).toBeCloseTo(38, 6);
  });

  it('gives no timing before a biofix', () => {
    expect(pestTiming(codlingMoth, [{ day: '2027-05-01', moths: 1 }], [], 2027).stages.every((s) => s.reachedOn === null)).toBe(true);
  });
});

describe('pest timing per season', () => {
  // Source: MSU Enviroweather codling moth model; Jones, Doerr & Brunner 2008: biofix on two successive catches,
  // first egg hatch at 250 DD°F (50/88 °F, single sine). 20 DD°F a day as above (UC IPM, Zalom et al. 1983).
  const warm = (year: number, from: number, n: number) =>
    Array.from({ length: n }, (_, i) => ({ day: `${year}-05-${String(from + i).padStart(2, '0')}`, tmin: 60, tmax: 80 }));
  const lastYear = [{ day: '2026-05-02', moths: 2 }, { day: '2026-05-05', moths: 4 }];
  const thisYear = [{ day: '2027-05-10', moths: 0 }, { day: '2027-05-12', moths: 1 }, { day: '2027-05-14', moths: 3 }];

  it('sets this season\'s biofix from this season\'s checks only, last season staying viewable', () => {
    const days = [...warm(2026, 2, 20), ...warm(2027, 10, 20)];
    const now = pestTiming(codlingMoth, [...lastYear, ...thisYear], days, 2027);
    expect(now).toMatchObject({ season: 2027, biofix: '2027-05-12' });
    expect(now.stages[0].reachedOn).toBe('2027-05-24'); // 13 x 20 = 260 >= 250, counted from 12 May
    const before = pestTiming(codlingMoth, [...lastYear, ...thisYear], days, 2026);
    expect(before).toMatchObject({ season: 2026, biofix: '2026-05-02' });
    expect(before.stages[0].reachedOn).toBe('2026-05-14');
  });

  it('predicts stages on estimated days and marks them as such', () => {
    const days = [...warm(2027, 12, 5), ...warm(2027, 17, 15).map((d) => ({ ...d, estimated: true }))];
    const t = pestTiming(codlingMoth, thisYear, days, 2027);
    expect(t.lastDay).toBe('2027-05-16');
    expect(t.degreeDaysF).toBeCloseTo(100, 6); // observed days only
    expect(t.stages[0]).toMatchObject({ reachedOn: '2027-05-24', estimated: true });
  });

  it('takes the season in the farm\'s time zone (a Pacific New Year\'s Eve evening is still last year)', () => {
    // 31 Dec 2026 20:00 in Los Angeles is 1 Jan 2027 04:00 UTC (IANA tz database, UTC-8 in winter).
    expect(seasonOf(new Date('2027-01-01T04:00:00Z'), 'America/Los_Angeles')).toBe(2026);
    expect(seasonOf(new Date('2027-01-01T04:00:00Z'), 'UTC')).toBe(2027);
  });
});

describe('suggested cover-spray days', () => {
  // First egg hatch (250 DD°F) to 20% egg hatch (350 DD°F), MSU Enviroweather codling moth model (from memory of
  // its spray-timing guidance: sprays against hatching larvae are timed from first hatch).
  const timing = {
    lastDay: '2027-05-25',
    stages: [
      { name: 'First egg hatch', degreeDaysF: 250, reachedOn: '2027-05-24', estimated: false },
      { name: '20% egg hatch', degreeDaysF: 350, reachedOn: '2027-05-29', estimated: true },
    ],
  };

  it('runs from first to 20% egg hatch, marking bloom, colonies on site and predicted days', () => {
    const days = suggestCoverSprayDays(timing, { bloom: { from: '2027-05-01', to: '2027-05-25' }, coloniesOnSite: [{ from: '2027-05-20', to: '2027-05-26' }] });
    expect(days.map((d) => d.day)).toEqual(['2027-05-24', '2027-05-25', '2027-05-26', '2027-05-27', '2027-05-28', '2027-05-29']);
    expect(days.map((d) => [d.duringBloom, d.coloniesOnSite, d.estimated])).toEqual([
      [true, true, false], [true, true, false], [false, true, true], [false, false, true], [false, false, true], [false, false, true],
    ]);
  });

  it('suggests nothing before first egg hatch is predicted, and only its day until 20% hatch is', () => {
    expect(suggestCoverSprayDays({ lastDay: null, stages: [{ ...timing.stages[0], reachedOn: null }, timing.stages[1]] }, { bloom: null, coloniesOnSite: [] })).toEqual([]);
    expect(suggestCoverSprayDays({ ...timing, stages: [timing.stages[0], { ...timing.stages[1], reachedOn: null }] }, { bloom: null, coloniesOnSite: [] }).map((d) => d.day)).toEqual(['2027-05-24']);
  });

  it('says that the label and a licensed applicator decide', () => {
    // The label is the law; local regulations and licensed applicators decide (common practice, no source).
    expect(sprayWindowCaution).toMatch(/label is the law/);
    expect(sprayWindowCaution).toMatch(/licensed applicator/);
  });
});
