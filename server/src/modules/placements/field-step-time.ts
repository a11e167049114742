// The time a field step (drop-off, strength check, pickup, photo) counts from: the time the
// phone recorded it, bounded when it is written. Never in the future beyond the clock
// tolerance, and never before the agreement was made. A time before the agreement is a
// 400 naming the field, not a time moved quietly: the colonies were not rented yet, so the
// phone's date or clock is wrong and only the crew can say when the step really happened.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import { badRequest } from '../../errors/http-errors.js';
import { boundRecordedAt, isBeforeAgreement } from '../../../../shared/domain/recorded-at.js';
import { zonedDateTime } from '../../../../shared/domain/zoned-time.js';
import { pleaseCheck } from '../../../../shared/labels/fields.js';

/** The phone's recorded time (or the time received when it sent none); a 400 when it is in the future. */
export function recordedOrReceived(value: string | undefined, field: string, received: Date): Date {
  const bounded = boundRecordedAt(value ? new Date(value) : null, received);
  if (!bounded.ok) throw badRequest(pleaseCheck([field]), { [field]: 'cannot be in the future' });
  return bounded.at;
}

/** A 400 naming `field` when `at` is before the agreement was made, in words the crew reads in its outbox. */
export async function refuseBeforeAgreement(
  ctx: AppContext, t: Transaction, agreement: { createdAt: Date; farmId: string }, at: Date, field: string, step: string,
): Promise<void> {
  if (!isBeforeAgreement(at, agreement.createdAt)) return;
  const farm = await ctx.models.Organization.findByPk(agreement.farmId, { attributes: ['timeZone'], transaction: t });
  const zone = farm?.timeZone ?? 'UTC';
  const made = zonedDateTime(agreement.createdAt, zone);
  throw badRequest(
    `The time recorded for this ${step} (${zonedDateTime(at, zone)}) is before the agreement was made (${made}). Check the date and time on the phone, then record it again.`,
    { [field]: `is before the agreement was made (${made})` },
  );
}
