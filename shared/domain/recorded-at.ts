// When a field step happened: the time the phone recorded it, which may reach the server
// hours later. A time more than the clock tolerance ahead of the server's receipt is
// refused (nothing is recorded in the future); a small lead (a phone clock a little fast)
// is taken as the time of receipt. Invoices also keep field times from going before the
// agreement was made (invoices.queries.ts), so a phone clock far behind bills nothing early.
export const clockToleranceMs = 5 * 60_000;

export type BoundedRecordedAt = { ok: true; at: Date } | { ok: false; reason: 'in-the-future' };

export function boundRecordedAt(recorded: Date | null, received: Date): BoundedRecordedAt {
  const at = recorded ?? received;
  if (at.getTime() > received.getTime() + clockToleranceMs) return { ok: false, reason: 'in-the-future' };
  return { ok: true, at: at > received ? received : at };
}
