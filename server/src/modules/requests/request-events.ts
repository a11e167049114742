// The audit trail of a hive request: who did what, when, with the details.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import { execute } from './sql.js';

export function recordRequestEvent(ctx: AppContext, t: Transaction | undefined, requestId: string, actorId: string | null, action: string, detail: Record<string, unknown> = {}) {
  return execute(
    ctx,
    'INSERT INTO hive_request_events (request_id, actor_id, action, detail, created_at) VALUES (:requestId, :actorId, :action, :detail::jsonb, :at)',
    { requestId, actorId, action, detail: JSON.stringify(detail), at: ctx.now().toISOString() },
    t,
  );
}
