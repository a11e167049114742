// Loads alerts as their DTOs for one viewing organization (which decides seenByMe and
// what it may see: a farm its own alerts, an apiary business the ones naming it).
import { QueryTypes, type Sequelize } from 'sequelize';
import { sprayCautions } from '../../../../shared/domain/conflict-grading.js';
import type { AlertDto, AlertEventDto } from '../../../../shared/schemas/alerts.js';

interface AlertRow {
  id: string; revision: string; state: AlertDto['state']; grade: AlertDto['grade']; grades: AlertDto['grades']; reasons: string[];
  findings: AlertDto['findings']; farm_id: string; farm_name: string; apiary_id: string | null; apiary_name: string | null;
  spray_id: string; spray_state: AlertDto['spray']['state']; product_name: string; epa_reg_no: string | null; starts_at: Date; ends_at: Date;
  block_names: string[]; seen_by_me: boolean; raised_at: Date; resolved_at: Date | null; updated_at: Date;
  history: Array<Omit<AlertEventDto, 'at'> & { at: string }>;
}

export interface AlertFilter {
  ids?: string[];
  sinceRevision?: number;
  openOnly?: boolean;
  sprayId?: string;
}

const iso = (d: Date | string) => new Date(d).toISOString();

export async function loadAlertDtos(sequelize: Sequelize, viewerOrgId: string, filter: AlertFilter = {}): Promise<AlertDto[]> {
  const where = ['(a.farm_id = :viewer OR a.apiary_id = :viewer)'];
  if (filter.ids) where.push('a.id = ANY(CAST(:ids AS uuid[]))');
  if (filter.sinceRevision !== undefined) where.push('a.revision > :since');
  if (filter.openOnly) where.push("a.state <> 'resolved'");
  if (filter.sprayId) where.push('a.spray_plan_id = :sprayId');
  const rows = await sequelize.query<AlertRow>(
    `SELECT a.id, a.revision, a.state, a.grade, a.grades, a.reasons, a.findings, a.farm_id, f.name AS farm_name, a.apiary_id, ap.name AS apiary_name,
       s.id AS spray_id, s.state AS spray_state, s.product_name, s.epa_reg_no, lower(s.planned_window) AS starts_at, upper(s.planned_window) AS ends_at,
       ARRAY(SELECT b.name FROM spray_plan_blocks sb JOIN blocks b ON b.id = sb.block_id WHERE sb.spray_plan_id = s.id ORDER BY b.name) AS block_names,
       EXISTS (SELECT 1 FROM alert_views v WHERE v.alert_id = a.id AND v.organization_id = :viewer) AS seen_by_me,
       a.raised_at, a.resolved_at, a.updated_at,
       (SELECT coalesce(json_agg(json_build_object('id', e.id::text, 'action', e.action, 'actorName', u.name, 'organizationName', o.name,
           'response', e.response, 'note', e.note, 'at', e.created_at) ORDER BY e.id), '[]')
        FROM alert_events e LEFT JOIN users u ON u.id = e.actor_id LEFT JOIN organizations o ON o.id = e.organization_id
        WHERE e.alert_id = a.id) AS history
     FROM alerts a
     JOIN spray_plans s ON s.id = a.spray_plan_id
     JOIN organizations f ON f.id = a.farm_id
     LEFT JOIN organizations ap ON ap.id = a.apiary_id
     WHERE ${where.join(' AND ')}
     ORDER BY a.revision DESC
     LIMIT 500`,
    {
      replacements: { viewer: viewerOrgId, ids: filter.ids ? `{${filter.ids.join(',')}}` : null, since: filter.sinceRevision ?? 0, sprayId: filter.sprayId ?? null },
      type: QueryTypes.SELECT,
    },
  );
  return rows.map((r) => ({
    id: r.id,
    revision: Number(r.revision),
    state: r.state,
    grade: r.grade,
    grades: r.grades,
    reasons: r.reasons,
    cautions: [...sprayCautions],
    farm: { id: r.farm_id, name: r.farm_name },
    apiary: r.apiary_id ? { id: r.apiary_id, name: r.apiary_name! } : null,
    spray: { id: r.spray_id, state: r.spray_state, productName: r.product_name, epaRegNo: r.epa_reg_no, startsAt: iso(r.starts_at), endsAt: iso(r.ends_at), blockNames: r.block_names },
    findings: r.findings,
    seenByMe: r.seen_by_me,
    raisedAt: iso(r.raised_at),
    resolvedAt: r.resolved_at ? iso(r.resolved_at) : null,
    updatedAt: iso(r.updated_at),
    history: r.history.map((e) => ({ ...e, at: iso(e.at) })),
  }));
}

/** Sends an alert to each organization it concerns, as that organization sees it. */
export async function organizationsOf(sequelize: Sequelize, alertId: string): Promise<string[]> {
  const [row] = await sequelize.query<{ farm_id: string; apiary_id: string | null }>('SELECT farm_id, apiary_id FROM alerts WHERE id = :alertId', {
    replacements: { alertId }, type: QueryTypes.SELECT,
  });
  return row ? [row.farm_id, ...(row.apiary_id ? [row.apiary_id] : [])] : [];
}
