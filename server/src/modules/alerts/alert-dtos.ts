// Loads alerts as their DTOs for one viewing organization (which decides seenByMe and
// what it may see: a farm its own alerts, an apiary business the ones naming it), through
// the models, on the caller's transaction when there is one.
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { Alert } from '../../db/models/alert.model.js';
import type { AlertEvent } from '../../db/models/alert-event.model.js';
import type { SprayPlan } from '../../db/models/spray-plan.model.js';
import type { SprayState } from '../../../../shared/schemas/sprays.js';
import { sprayCautions } from '../../../../shared/domain/conflict-grading.js';
import type { AlertDto, AlertEventDto } from '../../../../shared/schemas/alerts.js';

export interface AlertFilter {
  ids?: string[];
  sinceRevision?: number;
  /** With sinceRevision: also every alert changed at or after this time. */
  changedSince?: Date;
  openOnly?: boolean;
  sprayId?: string;
}

const iso = (d: Date) => d.toISOString();

export async function loadAlertDtos(ctx: AppContext, viewerOrgId: string, filter: AlertFilter = {}, transaction?: Transaction): Promise<AlertDto[]> {
  const { Alert, AlertEvent, AlertView, SprayPlanBlock } = ctx.models;
  const where: WhereOptions<Alert>[] = [{ [Op.or]: [{ farmId: viewerOrgId }, { apiaryId: viewerOrgId }] }];
  if (filter.ids) where.push({ id: filter.ids });
  if (filter.sinceRevision !== undefined) {
    const newer: WhereOptions<Alert> = { revision: { [Op.gt]: String(filter.sinceRevision) } };
    where.push(filter.changedSince ? { [Op.or]: [newer, { updatedAt: { [Op.gte]: filter.changedSince } }] } : newer);
  }
  if (filter.openOnly) where.push({ state: { [Op.ne]: 'resolved' } });
  if (filter.sprayId) where.push({ sprayPlanId: filter.sprayId });
  const alerts = await Alert.findAll({
    where: { [Op.and]: where },
    include: [
      { association: 'spray', attributes: ['id', 'state', 'productName', 'epaRegNo', 'plannedWindow'] },
      { association: 'farm', attributes: ['id', 'name', 'timeZone'] },
      { association: 'apiary', attributes: ['id', 'name'] },
    ],
    order: [['revision', 'DESC']],
    limit: 500,
    transaction,
  });
  if (!alerts.length) return [];
  const alertIds = alerts.map((a) => a.id);
  const events = await AlertEvent.findAll({
    where: { alertId: alertIds },
    include: [{ association: 'actor', attributes: ['name'] }, { association: 'organization', attributes: ['name'] }],
    order: [['id', 'ASC']],
    transaction,
  });
  const seen = new Set((await AlertView.findAll({ where: { alertId: alertIds, organizationId: viewerOrgId }, attributes: ['alertId'], transaction })).map((v) => v.alertId));
  const links = await SprayPlanBlock.findAll({
    where: { sprayPlanId: [...new Set(alerts.map((a) => a.sprayPlanId))] },
    include: [{ association: 'block', attributes: ['name'] }],
    transaction,
  });
  const blockNames = new Map<string, string[]>();
  for (const l of links) blockNames.set(l.sprayPlanId, [...(blockNames.get(l.sprayPlanId) ?? []), l.block!.name]);
  const history = new Map<string, AlertEventDto[]>();
  for (const e of events) {
    history.set(e.alertId, [...(history.get(e.alertId) ?? []), alertEventDtoOf(e)]);
  }

  return alerts.map((a) => alertDtoOf(a, {
    farm: a.farm!, apiary: a.apiary ?? null, spray: a.spray!, blockNames: blockNames.get(a.sprayPlanId) ?? [],
    seenByMe: seen.has(a.id), history: history.get(a.id) ?? [],
  }));
}

export interface AlertParts {
  farm: { id: string; name: string; timeZone: string };
  apiary: { id: string; name: string } | null;
  spray: { id: string; state: SprayState; productName: string; epaRegNo: string | null; plannedWindow: SprayPlan['plannedWindow'] };
  blockNames: string[];
  seenByMe: boolean;
  history: AlertEventDto[];
}

/** One alert as its DTO, from its row and the parts around it. */
export function alertDtoOf(a: Alert, parts: AlertParts): AlertDto {
  const { spray } = parts;
  return {
    id: a.id,
    revision: Number(a.revision),
    state: a.state,
    grade: a.grade,
    grades: a.grades,
    reasons: a.reasons,
    cautions: [...sprayCautions],
    farm: { id: parts.farm.id, name: parts.farm.name, timeZone: parts.farm.timeZone },
    apiary: parts.apiary ? { id: parts.apiary.id, name: parts.apiary.name } : null,
    spray: {
      id: spray.id, state: spray.state, productName: spray.productName, epaRegNo: spray.epaRegNo,
      startsAt: iso(spray.plannedWindow[0].value), endsAt: iso(spray.plannedWindow[1].value),
      blockNames: [...parts.blockNames].sort((x, y) => (x < y ? -1 : x > y ? 1 : 0)),
    },
    findings: a.findings,
    seenByMe: parts.seenByMe,
    raisedAt: iso(a.raisedAt),
    resolvedAt: a.resolvedAt ? iso(a.resolvedAt) : null,
    updatedAt: iso(a.updatedAt),
    history: parts.history,
  };
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
