// Loads alerts as their DTOs for one viewing organization (which decides seenByMe and
// what it may see: a farm its own alerts, an apiary business the ones naming it), each in
// one prepared statement (alerts.queries.ts), on the caller's transaction when there is one.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { Alert } from '../../db/models/alert.model.js';
import type { AlertEvent } from '../../db/models/alert-event.model.js';
import type { SprayPlan } from '../../db/models/spray-plan.model.js';
import type { SprayState } from '../../../../shared/schemas/sprays.js';
import { sprayCautions } from '../../../../shared/domain/conflict-grading.js';
import type { AlertDto, AlertEventDto } from '../../../../shared/schemas/alerts.js';
import { selectAlertList, selectAlertsById, type AlertViewRow } from './alerts.queries.js';

export interface AlertFilter {
  ids?: string[];
  sinceRevision?: number;
  /** With sinceRevision: also every alert changed at or after this time. */
  changedSince?: Date;
  openOnly?: boolean;
}

const iso = (d: Date) => d.toISOString();
const byName = (x: string, y: string) => (x < y ? -1 : x > y ? 1 : 0);

export async function loadAlertDtos(ctx: AppContext, viewerOrgId: string, filter: AlertFilter = {}, transaction?: Transaction): Promise<AlertDto[]> {
  const rows = filter.ids
    ? await selectAlertsById(ctx.sequelize, viewerOrgId, filter.ids, transaction)
    : await selectAlertList(ctx.sequelize, viewerOrgId, filter, transaction);
  return rows.map(alertDtoOfRow);
}

/** One alert as its DTO, from the row the viewer's statement gives. */
function alertDtoOfRow(r: AlertViewRow): AlertDto {
  return {
    id: r.id,
    revision: Number(r.revision),
    state: r.state,
    grade: r.grade,
    grades: r.grades,
    reasons: r.reasons,
    cautions: [...sprayCautions],
    farm: { id: r.farm_id, name: r.farm_name, timeZone: r.farm_time_zone },
    apiary: r.apiary_id ? { id: r.apiary_id, name: r.apiary_name! } : null,
    spray: {
      id: r.spray_id, state: r.spray_state, productName: r.product_name, epaRegNo: r.epa_reg_no,
      startsAt: iso(r.starts_at), endsAt: iso(r.ends_at), blockNames: [...r.block_names].sort(byName),
    },
    findings: r.findings,
    seenByMe: r.seen_by_me,
    raisedAt: iso(r.raised_at),
    resolvedAt: r.resolved_at ? iso(r.resolved_at) : null,
    updatedAt: iso(r.updated_at),
    history: r.history,
  };
}

export interface AlertParts {
  farm: { id: string; name: string; timeZone: string };
  apiary: { id: string; name: string } | null;
  spray: { id: string; state: SprayState; productName: string; epaRegNo: string | null; plannedWindow: SprayPlan['plannedWindow'] };
  blockNames: string[];
  seenByMe: boolean;
  history: AlertEventDto[];
}

/** One alert as its DTO, from its model and the parts around it (a just-raised alert, in the transaction that made it). */
export function alertDtoOf(a: Alert, parts: AlertParts): AlertDto {
  const { spray } = parts;
  return alertDtoOfRow({
    id: a.id, revision: a.revision, state: a.state, grade: a.grade, grades: a.grades, reasons: a.reasons, findings: a.findings,
    raised_at: a.raisedAt, resolved_at: a.resolvedAt, updated_at: a.updatedAt,
    farm_id: parts.farm.id, farm_name: parts.farm.name, farm_time_zone: parts.farm.timeZone,
    apiary_id: parts.apiary?.id ?? null, apiary_name: parts.apiary?.name ?? null,
    spray_id: spray.id, spray_state: spray.state, product_name: spray.productName, epa_reg_no: spray.epaRegNo,
    starts_at: spray.plannedWindow[0].value, ends_at: spray.plannedWindow[1].value,
    block_names: parts.blockNames, seen_by_me: parts.seenByMe, history: parts.history,
  });
}

/** A history step as its DTO. */
export function alertEventDtoOf(e: AlertEvent): AlertEventDto {
  return {
    id: String(e.id), action: e.action, actorName: e.actor?.name ?? null, organizationName: e.organization?.name ?? null,
    response: (e.response ?? null) as AlertEventDto['response'], note: e.note ?? null, at: iso(e.createdAt),
  };
}

/** The organizations an alert concerns: its farm, and the apiary business it names. */
export async function organizationsOf(ctx: AppContext, alertId: string, transaction?: Transaction): Promise<string[]> {
  const alert = await ctx.models.Alert.findByPk(alertId, { attributes: ['farmId', 'apiaryId'], transaction });
  return alert ? [alert.farmId, ...(alert.apiaryId ? [alert.apiaryId] : [])] : [];
}
