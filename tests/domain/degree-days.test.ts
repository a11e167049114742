// Degree days and chill units against the published methods and examples.
import { describe, it, expect } from 'vitest';
import { dailyDegreeDays, utahChillUnits, accumulateDegreeDays, dailyChillUnits, hourlyTemperatures, utahChillFromFall } from '../../shared/domain/degree-days.js';

describe('dailyDegreeDays', () => {
  it('average method: mean 64 °F over 53 °F gives 11 DD', () => {
    // Source: UC IPM, "How to manage pests: degree-days" (Zalom et al. 1983, UC DANR Leaflet 21373), worked example.
    expect(dailyDegreeDays(54, 74, 53, null, 'average')).toBe(11);
    expect(dailyDegreeDays(64, 64, 53, null, 'average')).toBe(11);
  });

  it('single triangle: Tmin 7, Tmax 14, TL 12 °C gives 0.29', () => {
    // Source: UC IPM 2016 example, as reproduced in the TrenchR R package documentation (degree_days).
    expect(dailyDegreeDays(7, 14, 12, null, 'triangle')).toBeCloseTo(0.29, 2);
  });

  it('single sine: Tmin 7, Tmax 14, TL 12 °C gives 0.47', () => {
    // Source: UC IPM 2016 example, as reproduced in the TrenchR R package documentation (degree_days).
    expect(dailyDegreeDays(7, 14, 12, null, 'sine')).toBeCloseTo(0.47, 2);
  });

  it('gives nothing when the whole day is at or below the lower threshold, for every method', () => {
    // Source: Zalom et al. 1983 (UC DANR Leaflet 21373): Tmax <= TL contributes 0.
    for (const method of ['average', 'triangle', 'sine'] as const) expect(dailyDegreeDays(30, 43, 43, null, method)).toBe(0);
  });

  it('gives mean minus threshold when the whole day is above the lower threshold (triangle and sine agree with average)', () => {
    // Source: Zalom et al. 1983: if Tmin >= TL, DD = M - TL for triangle and sine.
    for (const method of ['average', 'triangle', 'sine'] as const) expect(dailyDegreeDays(53, 75, 53, null, method)).toBe(11);
  });

  it('cuts off horizontally at the upper threshold (codling moth 50/88 °F)', () => {
    // Source: MSU Enviroweather codling moth model (Jones, Doerr & Brunner 2008): TL 50, TU 88 °F, horizontal cutoff.
    // A day entirely above TU counts as TU - TL.
    for (const method of ['average', 'triangle', 'sine'] as const) expect(dailyDegreeDays(90, 100, 50, 88, method)).toBe(38);
    // A day crossing TU gets less than without the cutoff, by the area above TU.
    const withCut = dailyDegreeDays(60, 100, 50, 88, 'sine');
    const noCut = dailyDegreeDays(60, 100, 50, null, 'sine');
    expect(withCut).toBeLessThan(noCut);
    expect(noCut).toBe(30);
    // Triangle above 88 for 60..100: (100-88)^2 / (2*40) = 1.8 (Sevacherian et al. 1977 formula).
    expect(dailyDegreeDays(60, 100, 50, 88, 'triangle')).toBeCloseTo(30 - 1.8, 10);
  });

  it('refuses a minimum above the maximum', () => {
    expect(() => dailyDegreeDays(20, 10, 5, null, 'sine')).toThrow(RangeError);
  });
});

describe('accumulateDegreeDays', () => {
  it('accumulates from the start date (or biofix) onward, in day order', () => {
    const days = [
      { day: '2027-03-02', tmin: 43, tmax: 63 },
      { day: '2027-02-28', tmin: 43, tmax: 83 },
      { day: '2027-03-01', tmin: 43, tmax: 53 },
    ];
    const series = accumulateDegreeDays(days, { lower: 43, upper: null, method: 'average', from: '2027-03-01' });
    expect(series.map((d) => d.day)).toEqual(['2027-03-01', '2027-03-02']);
    expect(series.map((d) => d.cumulative)).toEqual([5, 15]);
  });
});

describe('utahChillUnits', () => {
  // Source: Richardson, Seeley & Walker 1974, HortScience 9:331–332 (Utah model), as tabulated by
  // UC Fruit & Nut Research & Information Center: <=34 °F 0; 35–36 0.5; 37–48 1; 49–54 0.5;
  // 55–60 0; 61–65 -0.5; >65 -1. Edges between whole degrees (34.1 etc.) from memory of the tenths form.
  it.each([
    [20, 0], [34, 0], [34.1, 0.5], [35, 0.5], [36, 0.5], [36.1, 1], [37, 1], [48, 1], [48.1, 0.5], [49, 0.5],
    [54, 0.5], [54.1, 0], [55, 0], [60, 0], [60.1, -0.5], [61, -0.5], [65, -0.5], [65.1, -1], [66, -1], [90, -1],
  ])('%s °F gives %s chill units for one hour', (t, units) => {
    expect(utahChillUnits(t)).toBe(units);
  });

  it('a day held at 40 °F gives 24 chill units; a hot day loses units', () => {
    // Follows from the Utah table above (1 unit per hour at 37–48 °F).
    expect(dailyChillUnits(40, 40)).toBe(24);
    expect(dailyChillUnits(70, 90)).toBe(-24);
  });

  it('estimates the hours of a day from its minimum and maximum', () => {
    const hours = hourlyTemperatures(30, 50);
    expect(Math.min(...hours)).toBeCloseTo(30, 10);
    expect(Math.max(...hours)).toBeCloseTo(50, 10);
    expect(hours[5]).toBeCloseTo(30, 10);
    expect(hours[15]).toBeCloseTo(50, 10);
  });
});

describe('utahChillFromFall', () => {
  // Source: Richardson, Seeley & Walker 1974, "A model for estimating the completion of rest for Redhaven and
  // Elberta peach trees", HortScience 9:331–332: chill units are counted from the fall day their running total is
  // most negative (from memory of the paper). Units per hour as published: 40 °F +1 (24 a day), above 65 °F -1.
  const day = (md: string, tminF: number, tmaxF: number) => ({ day: `2026-${md}`, tminF, tmaxF });
  const run = (from: string, n: number, tminF: number, tmaxF: number) => Array.from({ length: n }, (_, i) => {
    const d = new Date(`2026-${from}T00:00:00Z`);
    d.setUTCDate(d.getUTCDate() + i);
    return day(d.toISOString().slice(5, 10), tminF, tmaxF);
  });

  it('starts the day after the most negative fall total, not on September 1', () => {
    // 10 hot days (70–90 °F: -24 a day) reach -240 on 10 September; 10 days at 40 °F then add 24 a day.
    const chill = utahChillFromFall([...run('09-01', 10, 70, 90), ...run('09-11', 10, 40, 40)], '2026-09-01');
    expect(chill.from).toBe('2026-09-11');
    expect(chill.total).toBe(240);
    expect(chill.series[0]).toEqual({ day: '2026-09-11', units: 24, cumulative: 24 });
  });

  it('starts on September 1 when the total never goes below zero, and ignores warm days after the fall', () => {
    const cool = utahChillFromFall(run('09-01', 5, 40, 40), '2026-09-01');
    expect(cool).toMatchObject({ from: '2026-09-01', total: 120 });
    // A warm January spell (after the fall) lowers the total but does not move the start.
    const winter = [...run('12-30', 2, 40, 40), { day: '2027-01-01', tminF: 70, tmaxF: 90 }, { day: '2027-01-02', tminF: 70, tmaxF: 90 }, { day: '2027-01-03', tminF: 70, tmaxF: 90 }];
    expect(utahChillFromFall(winter, '2026-09-01')).toMatchObject({ from: '2026-09-01', total: 48 - 72 });
  });

  it('waits for data when the fall total is still falling', () => {
    const warm = utahChillFromFall(run('09-01', 3, 70, 90), '2026-09-01');
    expect(warm).toEqual({ from: '2026-09-04', total: 0, series: [] });
  });
});
