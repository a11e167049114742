// Bees' flying hours from sunrise and sunset.
import { describe, it, expect } from 'vitest';
import { sunDay, beeFlightWindow, hoursDuringBeeFlight, overlapsBeeFlight } from '../../shared/domain/bee-flight.js';

// Source: Reda & Andreas, Solar Position Algorithm for Solar Radiation Applications, NREL/TP-560-34302
// (National Renewable Energy Laboratory, 2003, rev. 2008): Golden, Colorado, 39.742476 N, 105.1786 W,
// 2003-10-17, UTC-7, sunrise 06:12:43 local = 13:12:43 UTC. A general-purpose library agrees within ~2 min.
const golden = { lat: 39.742476, lon: -105.1786 };
const publishedSunrise = Date.parse('2003-10-17T13:12:43Z');

describe('bee flight hours', () => {
  it('finds the published sunrise at Golden, Colorado within 2 minutes', () => {
    const day = sunDay(new Date('2003-10-17T19:00:00Z'), golden.lat, golden.lon);
    expect(Math.abs(day.sunrise!.getTime() - publishedSunrise)).toBeLessThan(2 * 60_000);
  });

  it('starts flight 2 h before sunrise and ends 1 h after sunset by default (California bee-protection guidance, rule of thumb)', () => {
    const noon = new Date('2003-10-17T19:00:00Z');
    const day = sunDay(noon, golden.lat, golden.lon);
    const window = beeFlightWindow(noon, golden.lat, golden.lon)!;
    expect(window.from.getTime()).toBe(day.sunrise!.getTime() - 2 * 3_600_000);
    expect(window.to.getTime()).toBe(day.sunset!.getTime() + 1 * 3_600_000);
    expect(Math.abs(window.from.getTime() - (publishedSunrise - 2 * 3_600_000))).toBeLessThan(2 * 60_000);
  });

  it('takes other margins when configured', () => {
    const noon = new Date('2003-10-17T19:00:00Z');
    const narrow = beeFlightWindow(noon, golden.lat, golden.lon, { hoursBeforeSunrise: 0, hoursAfterSunset: 0 })!;
    expect(Math.abs(narrow.from.getTime() - publishedSunrise)).toBeLessThan(2 * 60_000);
  });

  it('counts a midday spray as during flight and a spray between 1 h after sunset and 2 h before sunrise as not', () => {
    // Local 10:00–12:00 (UTC-7) is in daylight.
    expect(hoursDuringBeeFlight(new Date('2003-10-17T17:00:00Z'), new Date('2003-10-17T19:00:00Z'), golden.lat, golden.lon)).toBeCloseTo(2, 5);
    // Local 22:00 to 02:00: sunset ~17:19 local, so more than 1 h after it, and long before 04:12.
    expect(overlapsBeeFlight(new Date('2003-10-18T05:00:00Z'), new Date('2003-10-18T09:00:00Z'), golden.lat, golden.lon)).toBe(false);
    // Local 03:30 to 05:00 overlaps the 2 h before sunrise (from ~04:13).
    const early = hoursDuringBeeFlight(new Date('2003-10-18T10:30:00Z'), new Date('2003-10-18T12:00:00Z'), golden.lat, golden.lon);
    expect(early).toBeGreaterThan(0.7);
    expect(early).toBeLessThan(0.85);
  });
});

describe('bee flight hours at high latitude and with bad input', () => {
  // 65° N, 25° E near midsummer: the sun sets for only about two hours (suncalc, a general-purpose sun-position
  // library), so 2 h before sunrise to 1 h after sunset covers the whole day and one day's window runs into the next.
  const north = { lat: 65, lon: 25 };

  it('never counts more hours than the span asked about', () => {
    const from = new Date('2027-06-20T00:00:00Z');
    const day = hoursDuringBeeFlight(from, new Date(from.getTime() + 24 * 3_600_000), north.lat, north.lon);
    expect(day).toBeLessThanOrEqual(24);
    expect(day).toBeCloseTo(24, 5); // every hour of the day lies in some day's window: counted once
    const week = hoursDuringBeeFlight(from, new Date(from.getTime() + 7 * 24 * 3_600_000), north.lat, north.lon);
    expect(week).toBeLessThanOrEqual(7 * 24);
  });

  it('rejects coordinates that are not finite numbers instead of answering 0 hours', () => {
    const from = new Date('2027-06-20T00:00:00Z');
    const to = new Date('2027-06-20T06:00:00Z');
    expect(() => hoursDuringBeeFlight(from, to, Number.NaN, 25)).toThrow(RangeError);
    expect(() => hoursDuringBeeFlight(from, to, 65, Number.POSITIVE_INFINITY)).toThrow(RangeError);
    expect(() => overlapsBeeFlight(from, to, Number.NaN, Number.NaN)).toThrow(/latitude/);
    expect(() => hoursDuringBeeFlight(new Date('not a date'), to, 65, 25)).toThrow(RangeError);
  });
});
