// Ends every session of a user (removed member, password changed) and closes their
// sockets, so nothing they had open keeps working.
import type { AppContext } from '../../context.js';
import { rooms } from '../../realtime/rooms.js';
import { deleteSessionsOf } from './auth.queries.js';

export async function endSessionsOf(ctx: AppContext, userId: string, options: { exceptSessionId?: string } = {}): Promise<number> {
  const ended = await deleteSessionsOf(ctx.sequelize, userId, options.exceptSessionId ?? '');
  ctx.io.in(rooms.user(userId)).disconnectSockets(true);
  return ended.length;
}
