// The sessions table belongs to the session store (connect-pg-simple), so it has no
// model: ending a user's sessions is a statement of its own. The session's user is read on
// every signed-in request, so that read is a prepared statement (planned once per connection).
import type { Sequelize } from 'sequelize';
import { prepareStatement, queryPrepared, queryRows } from '../../db/query-rows.js';
import type { AuthUserSource } from './auth-user.js';

const sessionUserStatement = prepareStatement('session-user', `
  SELECT u.id, u.email, u.name, u.role, u.units, u.time_zone,
    o.id AS organization_id, o.kind AS organization_kind, o.name AS organization_name, o.time_zone AS organization_time_zone
  FROM users u LEFT JOIN organizations o ON o.id = u.organization_id
  WHERE u.id = $id::uuid AND u.disabled_at IS NULL`);

/** The session's user, not disabled, with only the columns a request needs. */
export async function selectSessionUser(sequelize: Sequelize, id: string): Promise<AuthUserSource | null> {
  const [row] = await queryPrepared<{
    id: string; email: string; name: string; role: AuthUserSource['role']; units: AuthUserSource['units']; time_zone: string | null;
    organization_id: string | null; organization_kind: NonNullable<AuthUserSource['organization']>['kind']; organization_name: string; organization_time_zone: string;
  }>(sequelize, sessionUserStatement, { id });
  if (!row) return null;
  return {
    id: row.id, email: row.email, name: row.name, role: row.role, units: row.units, timeZone: row.time_zone,
    organization: row.organization_id ? { id: row.organization_id, kind: row.organization_kind, name: row.organization_name, timeZone: row.organization_time_zone } : null,
  };
}

/** Deletes every stored session of the user except one; gives the ended session ids. */
export async function deleteSessionsOf(sequelize: Sequelize, userId: string, exceptSessionId: string): Promise<string[]> {
  const rows = await queryRows<{ sid: string }>(
    sequelize,
    `DELETE FROM user_sessions WHERE (sess -> 'passport' ->> 'user') = :userId AND sid <> :except RETURNING sid`,
    { replacements: { userId, except: exceptSessionId } },
  );
  return rows.map((r) => r.sid);
}
