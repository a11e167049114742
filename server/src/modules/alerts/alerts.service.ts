// Reading and answering conflict alerts. A farm sees its own alerts, an apiary business
// the ones that name it; anything else is 404. Seeing and answering are kept in the history,
// and their publication job is written in the same transaction (alert-outbox.ts).
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { badRequest, notFound, wrongState } from '../../errors/http-errors.js';
import { apiaryResponses, farmResponses, type AlertAnswer, type AlertDto, type AlertListDto, type AlertListQuery } from '../../../../shared/schemas/alerts.js';
import { loadAlertDtos } from './alert-dtos.js';
import { queueAlertPublication } from './alert-outbox.js';
import { alertCounts, changedUpTo } from './alerts.queries.js';
import { pleaseCheck } from '../../../../shared/labels/fields.js';
import { alertResponseSet } from '../../../../shared/labels/alerts.js';
import { labelOf } from '../../../../shared/labels/label-set.js';

/** How far before the held revision a catch-up reaches: longer than any save's transaction. */
const catchUpReachMs = 10 * 60_000;

function orgOf(user: AuthUser): string {
  if (!user.organizationId) throw notFound('That alert');
  return user.organizationId;
}

export function createAlertsService(ctx: AppContext) {
  const { Alert, AlertEvent, AlertView } = ctx.models;

  async function load(user: AuthUser, id: string, transaction?: Transaction): Promise<AlertDto> {
    const [dto] = await loadAlertDtos(ctx, orgOf(user), { ids: [id] }, transaction);
    if (!dto) throw notFound('That alert');
    return dto;
  }

  /** The side that has to act on an alert first: the apiary business, or the farm for bloom alone. */
  const isReceivingSide = (user: AuthUser, alert: AlertDto) => (alert.apiary ? alert.apiary.id : alert.farm.id) === user.organizationId;

  async function markSeen(user: AuthUser, alert: AlertDto, transaction: Transaction): Promise<boolean> {
    const now = ctx.now();
    const [, created] = await AlertView.findOrCreate({
      where: { alertId: alert.id, organizationId: user.organizationId! },
      defaults: { alertId: alert.id, organizationId: user.organizationId!, seenBy: user.id, seenAt: now },
      transaction,
    });
    if (!created) return false;
    await AlertEvent.create({ alertId: alert.id, action: 'seen', actorId: user.id, organizationId: user.organizationId, createdAt: now }, { transaction });
    const state = alert.state === 'raised' && isReceivingSide(user, alert) ? 'seen' : alert.state;
    await Alert.update({ state, revision: ctx.sequelize.literal("nextval('alert_revisions')"), updatedAt: now }, { where: { id: alert.id }, transaction, silent: true });
    return true;
  }

  return {
    async list(user: AuthUser, query: AlertListQuery): Promise<AlertListDto> {
      const orgId = orgOf(user);
      // The latest revision is read before the alerts, so an alert changed in between is
      // sent again on the next catch-up rather than skipped.
      const counts = await alertCounts(ctx.sequelize, orgId);
      // A catch-up also sends what changed shortly before the revision the client holds: a
      // save that took a lower revision may have committed after that one (and its live
      // publication missed a client that was away). Clients drop what they already hold.
      const heldChangedAt = query.since !== undefined ? await changedUpTo(ctx.sequelize, orgId, query.since) : null;
      const changedSince = heldChangedAt ? new Date(heldChangedAt.getTime() - catchUpReachMs) : undefined;
      const alerts = await loadAlertDtos(ctx, orgId, { sinceRevision: query.since, changedSince, openOnly: query.state === 'open' });
      return { alerts, latestRevision: counts.latest ?? query.since ?? 0, unseen: counts.unseen };
    },

    get: (user: AuthUser, id: string) => load(user, id),

    async seen(user: AuthUser, id: string): Promise<AlertDto> {
      return ctx.sequelize.transaction(async (transaction) => {
        const alert = await load(user, id, transaction);
        if (await markSeen(user, alert, transaction)) await queueAlertPublication(ctx, transaction, id, 'alert:updated');
        return load(user, id, transaction);
      });
    },

    async answer(user: AuthUser, id: string, answer: AlertAnswer): Promise<AlertDto> {
      const allowed: readonly string[] = user.organizationKind === 'apiary' ? apiaryResponses : farmResponses;
      return ctx.sequelize.transaction(async (transaction) => {
        await Alert.findByPk(id, { attributes: ['id'], lock: transaction.LOCK.UPDATE, transaction });
        const alert = await load(user, id, transaction);
        if (alert.state === 'resolved') throw wrongState('This alert is resolved: the check no longer finds a conflict.');
        if (!allowed.includes(answer.response)) throw badRequest(pleaseCheck(['response']), { response: `must be one of: ${allowed.map((r) => labelOf(alertResponseSet, r)).join('; ')}` });
        const now = ctx.now();
        await markSeen(user, alert, transaction);
        await AlertEvent.create(
          { alertId: id, action: 'answered', actorId: user.id, organizationId: user.organizationId, response: answer.response, note: answer.note ?? null, createdAt: now },
          { transaction },
        );
        await Alert.update({ state: 'answered', revision: ctx.sequelize.literal("nextval('alert_revisions')"), updatedAt: now }, { where: { id }, transaction, silent: true });
        await queueAlertPublication(ctx, transaction, id, 'alert:updated');
        return load(user, id, transaction);
      });
    },
  };
}

export type AlertsService = ReturnType<typeof createAlertsService>;
