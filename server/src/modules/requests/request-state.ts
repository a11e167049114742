// Colonies committed to a request, and its open/fully-committed state that follows from them.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import { selectOne, execute } from './sql.js';
import { recordRequestEvent } from './request-events.js';

export async function committedColonies(ctx: AppContext, requestId: string, t?: Transaction): Promise<number> {
  const row = await selectOne<{ total: string }>(
    ctx,
    "SELECT coalesce(sum(colonies), 0) AS total FROM commitments WHERE request_id = :requestId AND state IN ('offered', 'accepted')",
    { requestId },
    t,
  );
  return Number(row!.total);
}

/** Moves a listed request to filled when fully committed, and back when colonies come free. Call with the request row locked. */
export async function refreshFillState(ctx: AppContext, requestId: string, actorId: string | null, t: Transaction): Promise<{ state: string; coloniesOpen: number }> {
  const request = (await selectOne<{ state: string; colonies_requested: number }>(ctx, 'SELECT state, colonies_requested FROM hive_requests WHERE id = :requestId', { requestId }, t))!;
  const committed = await committedColonies(ctx, requestId, t);
  const coloniesOpen = Math.max(0, request.colonies_requested - committed);
  let state = request.state;
  if (state === 'listed' && coloniesOpen === 0) state = 'filled';
  else if (state === 'filled' && coloniesOpen > 0) state = 'listed';
  if (state !== request.state) {
    await execute(ctx, 'UPDATE hive_requests SET state = :state, updated_at = now() WHERE id = :requestId', { state, requestId }, t);
    await recordRequestEvent(ctx, t, requestId, actorId, state === 'filled' ? 'fully-committed' : 'reopened', { coloniesOpen });
  }
  return { state, coloniesOpen };
}
