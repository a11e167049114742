// The time a field step counts from, when the phone recorded it before it could send it.
// The five-minute clock tolerance is common practice, no source (phones set their clocks
// from the network, usually to within seconds; a few minutes covers a phone set by hand).
import { describe, it, expect } from 'vitest';
import { boundRecordedAt, clockToleranceMs, isBeforeAgreement } from '../../shared/domain/recorded-at.js';

const received = new Date('2027-04-10T07:40:00Z');

describe('boundRecordedAt', () => {
  it('keeps a time recorded hours before it arrived', () => {
    expect(boundRecordedAt(new Date('2027-04-10T05:12:00Z'), received)).toEqual({ ok: true, at: new Date('2027-04-10T05:12:00Z') });
  });
  it('uses the time of receipt when the phone sent no time', () => {
    expect(boundRecordedAt(null, received)).toEqual({ ok: true, at: received });
  });
  it('takes a phone clock a little fast as the time of receipt, never a time in the future', () => {
    expect(boundRecordedAt(new Date(received.getTime() + 90_000), received)).toEqual({ ok: true, at: received });
  });
  it('refuses a time further ahead than the tolerance', () => {
    expect(boundRecordedAt(new Date(received.getTime() + clockToleranceMs + 1000), received)).toEqual({ ok: false, reason: 'in-the-future' });
  });
});

describe('isBeforeAgreement', () => {
  // Common practice, no source: colonies are rented from the moment the agreement exists.
  const made = new Date('2027-03-20T16:00:00Z');
  it('finds a time before the agreement was made', () => {
    expect(isBeforeAgreement(new Date('2027-03-20T15:59:59Z'), made)).toBe(true);
  });
  it('accepts the moment it was made and any time after', () => {
    expect(isBeforeAgreement(made, made)).toBe(false);
    expect(isBeforeAgreement(new Date('2027-04-10T05:12:00Z'), made)).toBe(false);
  });
});
