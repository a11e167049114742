// Ends every session of a user (removed member, password changed) and closes their
// sockets, so nothing they had open keeps working.
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../../context.js';
import { rooms } from '../../realtime/rooms.js';

export async function endSessionsOf(ctx: AppContext, userId: string, options: { exceptSessionId?: string } = {}): Promise<number> {
  const ended = await ctx.sequelize.query<{ sid: string }>(
    `DELETE FROM user_sessions WHERE (sess -> 'passport' ->> 'user') = :userId AND sid <> :except RETURNING sid`,
    { replacements: { userId, except: options.exceptSessionId ?? '' }, type: QueryTypes.SELECT },
  );
  ctx.io.in(rooms.user(userId)).disconnectSockets(true);
  return ended.length;
}
