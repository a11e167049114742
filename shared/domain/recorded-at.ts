// When a field step happened: the time the phone recorded it, which may reach the server
// hours later. A time more than the clock tolerance ahead of the server's receipt is
// refused (nothing is recorded in the future); a small lead (a phone clock a little fast)
// is taken as the time of receipt. A time before the agreement was made is refused too
// (isBeforeAgreement): those colonies were not rented yet, so the phone's date or clock is
// wrong, and only the crew can say what the right time was; moving it silently would record
// a time nobody saw. Invoices still clamp field times to the agreement (invoices.queries.ts)
// for rows stored before that rule.
export const clockToleranceMs = 5 * 60_000;

export type BoundedRecordedAt = { ok: true; at: Date } | { ok: false; reason: 'in-the-future' };

export function boundRecordedAt(recorded: Date | null, received: Date): BoundedRecordedAt {
  const at = recorded ?? received;
  if (at.getTime() > received.getTime() + clockToleranceMs) return { ok: false, reason: 'in-the-future' };
  return { ok: true, at: at > received ? received : at };
}

/** A field time before the agreement was made (its created_at, the time invoices clamp to); no tolerance: it is refused, never moved. */
export function isBeforeAgreement(at: Date, agreementMadeAt: Date): boolean {
  return at.getTime() < agreementMadeAt.getTime();
}
