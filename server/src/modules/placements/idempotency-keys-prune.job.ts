// Removes old Idempotency-Key rows of the field steps (field-records-once.ts): a pg-boss
// schedule runs this once a day. A key only has to outlive the repeats its phone may still
// send: the outbox retries within seconds, on reconnect and when the app opens, so a record
// waits for a signal for hours or days, rarely weeks. We keep keys 30 days (common practice,
// no source): longer than colonies usually stay on a block (a bloom of two to four weeks)
// and than a phone stays offline in practice, while the table stays small (each row holds
// the first answer, a whole placement). A repeat arriving after that is taken as a new
// request: a drop-off or pickup sent again is a 409 with what is recorded, nothing doubled;
// a strength check or photo sent again would be stored a second time.
import { Op } from 'sequelize';
import type { AppContext } from '../../context.js';
import { queueNames } from '../../jobs/queue-names.js';

export const idempotencyKeyRetentionDays = 30;
/** Every day at 03:17 UTC: a quiet hour for field crews, off the hourly reminder run. */
export const idempotencyKeyPruneCron = '17 3 * * *';

/** Deletes the keys claimed more than the retention ago; answers how many went. */
export async function pruneIdempotencyKeys(ctx: AppContext): Promise<number> {
  const claimedBefore = new Date(ctx.now().getTime() - idempotencyKeyRetentionDays * 86_400_000);
  return ctx.models.IdempotencyKey.destroy({ where: { startedAt: { [Op.lt]: claimedBefore } } });
}

export async function startIdempotencyKeyPrune(ctx: AppContext) {
  await ctx.jobs.addWorker(queueNames.idempotencyKeyPrune, async () => {
    const removed = await pruneIdempotencyKeys(ctx);
    ctx.logger.info({ removed }, 'old idempotency keys removed');
  });
  await ctx.jobs.schedule(queueNames.idempotencyKeyPrune, idempotencyKeyPruneCron);
}
