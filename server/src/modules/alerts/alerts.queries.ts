// SQL the alert models cannot say well: the viewer's counts (latest revision, unseen open
// alerts), when its alerts up to a revision were last changed, and the transaction-scoped advisory lock that orders a re-check after the change
// that asked for it. Bind parameters only.
import type { Sequelize, Transaction } from 'sequelize';
import { queryOne } from '../../db/query-rows.js';

export async function alertCounts(sequelize: Sequelize, orgId: string): Promise<{ latest: number | null; unseen: number }> {
  const row = await queryOne<{ latest: string | null; unseen: number }>(
    sequelize,
    `SELECT max(a.revision) AS latest,
       count(*) FILTER (WHERE a.state <> 'resolved' AND NOT EXISTS (SELECT 1 FROM alert_views v WHERE v.alert_id = a.id AND v.organization_id = $orgId))::int AS unseen
     FROM alerts a WHERE a.farm_id = $orgId OR a.apiary_id = $orgId`,
    { bind: { orgId } },
  );
  return { latest: row?.latest == null ? null : Number(row.latest), unseen: row?.unseen ?? 0 };
}

/**
 * When the viewer's alerts up to this revision were last changed: revisions come from one
 * sequence as transactions take them, and a transaction can commit after one that took a
 * higher revision, so a catch-up reaches back from here (see alerts.service.ts).
 */
export async function changedUpTo(sequelize: Sequelize, orgId: string, revision: number): Promise<Date | null> {
  const row = await queryOne<{ at: Date | null }>(
    sequelize,
    'SELECT max(a.updated_at) AS at FROM alerts a WHERE (a.farm_id = $orgId OR a.apiary_id = $orgId) AND a.revision <= $revision',
    { bind: { orgId, revision } },
  );
  return row?.at ?? null;
}

/**
 * Holds a re-check key until the transaction ends: shared by each change that asks for the
 * re-check, exclusive by the re-check itself, which therefore reads only after every such
 * change has committed (a waiting job that the change's own job collapsed into cannot run
 * ahead of it).
 */
export async function holdRecheckKey(sequelize: Sequelize, transaction: Transaction, key: string, mode: 'shared' | 'exclusive'): Promise<void> {
  const sql = mode === 'shared' ? 'SELECT pg_advisory_xact_lock_shared(hashtextextended($key, 0))' : 'SELECT pg_advisory_xact_lock(hashtextextended($key, 0))';
  await queryOne(sequelize, sql, { bind: { key }, transaction });
}
