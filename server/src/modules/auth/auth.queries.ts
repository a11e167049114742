// The sessions table belongs to the session store (connect-pg-simple), so it has no
// model: ending a user's sessions is a statement of its own.
import type { Sequelize } from 'sequelize';
import { queryRows } from '../../db/query-rows.js';

/** Deletes every stored session of the user except one; gives the ended session ids. */
export async function deleteSessionsOf(sequelize: Sequelize, userId: string, exceptSessionId: string): Promise<string[]> {
  const rows = await queryRows<{ sid: string }>(
    sequelize,
    `DELETE FROM user_sessions WHERE (sess -> 'passport' ->> 'user') = :userId AND sid <> :except RETURNING sid`,
    { replacements: { userId, except: exceptSessionId } },
  );
  return rows.map((r) => r.sid);
}
