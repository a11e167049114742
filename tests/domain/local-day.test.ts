// Answer deadlines and trap-check days are local calendar days in the farm's time zone.
import { describe, it, expect } from 'vitest';
import { dayIsOver, localDay } from '../../shared/domain/local-day.js';

// Offsets from the IANA time zone database: America/Los_Angeles is UTC-7 in May (daylight time).
describe('local days', () => {
  it('gives a Pacific evening its own date, not tomorrow\'s UTC date', () => {
    expect(localDay(new Date('2027-05-15T03:30:00Z'), 'America/Los_Angeles')).toBe('2027-05-14'); // 20:30 on 14 May
    expect(localDay(new Date('2027-05-15T03:30:00Z'), 'UTC')).toBe('2027-05-15');
  });

  it('keeps a deadline of 15 May open until midnight at the farm, about 7 hours after UTC midnight', () => {
    const zone = 'America/Los_Angeles';
    expect(dayIsOver('2027-05-15', new Date('2027-05-16T01:00:00Z'), zone)).toBe(false); // 18:00 on 15 May, local
    expect(dayIsOver('2027-05-15', new Date('2027-05-16T06:59:59Z'), zone)).toBe(false); // 23:59:59 local
    expect(dayIsOver('2027-05-15', new Date('2027-05-16T07:00:00Z'), zone)).toBe(true); // midnight local
    expect(dayIsOver(null, new Date('2030-01-01T00:00:00Z'), zone)).toBe(false);
  });

  it('refuses an unknown time zone', () => {
    expect(() => localDay(new Date(), 'Mars/Olympus')).toThrow(RangeError);
  });
});
