// Colonies committed to a request, and its open/fully-committed state that follows from them.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import { recordRequestEvent } from './request-events.js';

export async function committedColonies(ctx: AppContext, requestId: string, t?: Transaction): Promise<number> {
  return (await ctx.models.Commitment.scope('holding').sum('colonies', { where: { requestId }, transaction: t })) ?? 0;
}

/** Colonies a request still needs. */
export async function coloniesOpen(ctx: AppContext, requestId: string, t?: Transaction): Promise<{ state: string; coloniesOpen: number }> {
  const request = await ctx.models.HiveRequest.findByPk(requestId, { attributes: ['state', 'coloniesRequested'], transaction: t, rejectOnEmpty: true });
  return { state: request.state, coloniesOpen: Math.max(0, request.coloniesRequested - (await committedColonies(ctx, requestId, t))) };
}

/** Moves a listed request to filled when fully committed, and back when colonies come free. Call with the request row locked. */
export async function refreshFillState(ctx: AppContext, requestId: string, actorId: string | null, t: Transaction): Promise<{ state: string; coloniesOpen: number }> {
  const request = await ctx.models.HiveRequest.findByPk(requestId, { transaction: t, rejectOnEmpty: true });
  const open = Math.max(0, request.coloniesRequested - (await committedColonies(ctx, requestId, t)));
  let state = request.state;
  if (state === 'listed' && open === 0) state = 'filled';
  else if (state === 'filled' && open > 0) state = 'listed';
  if (state !== request.state) {
    await request.update({ state }, { transaction: t });
    await recordRequestEvent(ctx, t, requestId, actorId, state === 'filled' ? 'fully-committed' : 'reopened', { coloniesOpen: open });
  }
  return { state, coloniesOpen: open };
}
