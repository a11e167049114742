// SQL the alert models cannot say well: the viewer's alerts as one statement each (the
// list every page of the app asks for, with each alert's farm, apiary, spray, sprayed
// blocks, whether the viewer has seen it and its history; prepared, so planned once per
// connection), the viewer's counts (latest revision, unseen open alerts), when its alerts
// up to a revision were last changed, and the transaction-scoped advisory lock that orders
// a re-check after the change that asked for it. Bind parameters only.
import type { Sequelize, Transaction } from 'sequelize';
import { prepareStatement, queryOne, queryPrepared } from '../../db/query-rows.js';
import type { AlertEventDto, AlertFinding, AlertState } from '../../../../shared/schemas/alerts.js';
import type { ConflictGrade } from '../../../../shared/domain/conflict-grading.js';
import type { SprayState } from '../../../../shared/schemas/sprays.js';

/** One alert as the viewer sees it, with the parts around it. */
export interface AlertViewRow {
  id: string; revision: string; state: AlertState; grade: ConflictGrade; grades: ConflictGrade[]; reasons: string[]; findings: AlertFinding;
  raised_at: Date; resolved_at: Date | null; updated_at: Date;
  farm_id: string; farm_name: string; farm_time_zone: string; apiary_id: string | null; apiary_name: string | null;
  spray_id: string; spray_state: SprayState; product_name: string; epa_reg_no: string | null; starts_at: Date; ends_at: Date;
  block_names: string[]; seen_by_me: boolean;
  history: AlertEventDto[];
}

const alertViewColumns = `
  a.id, a.revision, a.state, a.grade, a.grades, a.reasons, a.findings, a.raised_at, a.resolved_at, a.updated_at,
  f.id AS farm_id, f.name AS farm_name, f.time_zone AS farm_time_zone, ap.id AS apiary_id, ap.name AS apiary_name,
  s.id AS spray_id, s.state AS spray_state, s.product_name, s.epa_reg_no, lower(s.planned_window) AS starts_at, upper(s.planned_window) AS ends_at,
  coalesce((SELECT array_agg(b.name) FROM spray_plan_blocks sb JOIN blocks b ON b.id = sb.block_id WHERE sb.spray_plan_id = s.id), '{}') AS block_names,
  EXISTS (SELECT 1 FROM alert_views v WHERE v.alert_id = a.id AND v.organization_id = $orgId::uuid) AS seen_by_me,
  coalesce((SELECT json_agg(json_build_object(
      'id', e.id::text, 'action', e.action, 'actorName', u.name, 'organizationName', o.name, 'response', e.response, 'note', e.note,
      'at', to_char(e.created_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')) ORDER BY e.id)
    FROM alert_events e LEFT JOIN users u ON u.id = e.actor_id LEFT JOIN organizations o ON o.id = e.organization_id
    WHERE e.alert_id = a.id), '[]') AS history
  FROM alerts a
  JOIN organizations f ON f.id = a.farm_id
  LEFT JOIN organizations ap ON ap.id = a.apiary_id
  JOIN spray_plans s ON s.id = a.spray_plan_id`;

const alertsByIdStatement = prepareStatement('alerts-by-id', `
  SELECT ${alertViewColumns}
  WHERE a.id = ANY($ids::uuid[]) AND (a.farm_id = $orgId::uuid OR a.apiary_id = $orgId::uuid)
  ORDER BY a.revision DESC`);

const alertListStatement = prepareStatement('alert-list', `
  SELECT ${alertViewColumns}
  WHERE (a.farm_id = $orgId::uuid OR a.apiary_id = $orgId::uuid)
    AND ($sinceRevision::bigint IS NULL OR a.revision > $sinceRevision::bigint OR a.updated_at >= $changedSince::timestamptz)
    AND (NOT $openOnly::boolean OR a.state <> 'resolved')
  ORDER BY a.revision DESC
  LIMIT 500`);

/** The viewer's alerts with these ids (none it may not see). */
export function selectAlertsById(sequelize: Sequelize, orgId: string, ids: string[], transaction?: Transaction): Promise<AlertViewRow[]> {
  return queryPrepared<AlertViewRow>(sequelize, alertsByIdStatement, { orgId, ids }, transaction);
}

/**
 * The viewer's latest 500 alerts, newest revision first: with `sinceRevision`, those past
 * it (and, with `changedSince`, those changed since then too); with `openOnly`, none resolved.
 */
export function selectAlertList(
  sequelize: Sequelize, orgId: string, filter: { sinceRevision?: number; changedSince?: Date; openOnly?: boolean }, transaction?: Transaction,
): Promise<AlertViewRow[]> {
  return queryPrepared<AlertViewRow>(sequelize, alertListStatement, {
    orgId, sinceRevision: filter.sinceRevision ?? null, changedSince: filter.changedSince ?? null, openOnly: filter.openOnly ?? false,
  }, transaction);
}

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
