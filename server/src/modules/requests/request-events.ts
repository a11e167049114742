// The audit trail of a hive request: who did what, when, with the details.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';

export async function recordRequestEvent(ctx: AppContext, t: Transaction | undefined, requestId: string, actorId: string | null, action: string, detail: Record<string, unknown> = {}) {
  await ctx.models.HiveRequestEvent.create({ requestId, actorId, action, detail, createdAt: ctx.now() }, { transaction: t });
}
