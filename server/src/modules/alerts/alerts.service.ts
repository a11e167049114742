// Reading and answering conflict alerts. A farm sees its own alerts, an apiary business
// the ones that name it; anything else is 404. Seeing and answering are kept in the history.
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { badRequest, notFound, wrongState } from '../../errors/http-errors.js';
import { apiaryResponses, farmResponses, type AlertAnswer, type AlertDto, type AlertListDto, type AlertListQuery } from '../../../../shared/schemas/alerts.js';
import { loadAlertDtos } from './alert-dtos.js';
import { publishAlert } from './alert-publish.js';

function orgOf(user: AuthUser): string {
  if (!user.organizationId) throw notFound('That alert');
  return user.organizationId;
}

export function createAlertsService(ctx: AppContext) {
  const seq = ctx.sequelize;

  async function load(user: AuthUser, id: string): Promise<AlertDto> {
    const [dto] = await loadAlertDtos(seq, orgOf(user), { ids: [id] });
    if (!dto) throw notFound('That alert');
    return dto;
  }

  /** The side that has to act on an alert first: the apiary business, or the farm for bloom alone. */
  const isReceivingSide = (user: AuthUser, alert: AlertDto) => (alert.apiary ? alert.apiary.id : alert.farm.id) === user.organizationId;

  async function markSeen(user: AuthUser, alert: AlertDto, transaction: import('sequelize').Transaction) {
    const now = ctx.now().toISOString();
    const inserted = await seq.query<{ alert_id: string }>(
      `INSERT INTO alert_views (alert_id, organization_id, seen_by, seen_at) VALUES (:alertId, :orgId, :userId, :now)
       ON CONFLICT DO NOTHING RETURNING alert_id`,
      { replacements: { alertId: alert.id, orgId: user.organizationId, userId: user.id, now }, type: QueryTypes.SELECT, transaction },
    );
    if (!inserted.length) return false;
    await seq.query(
      `INSERT INTO alert_events (alert_id, action, actor_id, organization_id, created_at) VALUES (:alertId, 'seen', :userId, :orgId, :now)`,
      { replacements: { alertId: alert.id, orgId: user.organizationId, userId: user.id, now }, transaction },
    );
    const nextState = alert.state === 'raised' && isReceivingSide(user, alert) ? 'seen' : alert.state;
    await seq.query(`UPDATE alerts SET state = :nextState, revision = nextval('alert_revisions'), updated_at = :now WHERE id = :id`, {
      replacements: { id: alert.id, nextState, now }, transaction,
    });
    return true;
  }

  return {
    async list(user: AuthUser, query: AlertListQuery): Promise<AlertListDto> {
      const orgId = orgOf(user);
      const alerts = await loadAlertDtos(seq, orgId, { sinceRevision: query.since, openOnly: query.state === 'open' });
      const [counts] = await seq.query<{ latest: string | null; unseen: number }>(
        `SELECT max(a.revision) AS latest,
           count(*) FILTER (WHERE a.state <> 'resolved' AND NOT EXISTS (SELECT 1 FROM alert_views v WHERE v.alert_id = a.id AND v.organization_id = :orgId))::int AS unseen
         FROM alerts a WHERE a.farm_id = :orgId OR a.apiary_id = :orgId`,
        { replacements: { orgId }, type: QueryTypes.SELECT },
      );
      return { alerts, latestRevision: Number(counts.latest ?? query.since ?? 0), unseen: counts.unseen };
    },

    get: load,

    async seen(user: AuthUser, id: string): Promise<AlertDto> {
      const alert = await load(user, id);
      const changed = await seq.transaction((t) => markSeen(user, alert, t));
      if (changed) await publishAlert(ctx, id, 'alert:updated');
      return load(user, id);
    },

    async answer(user: AuthUser, id: string, answer: AlertAnswer): Promise<AlertDto> {
      const alert = await load(user, id);
      if (alert.state === 'resolved') throw wrongState('This alert is resolved: the check no longer finds a conflict.');
      const allowed: readonly string[] = user.organizationKind === 'apiary' ? apiaryResponses : farmResponses;
      if (!allowed.includes(answer.response)) throw badRequest('Please check: response.', { response: `must be one of ${allowed.join(', ')}` });
      const now = ctx.now().toISOString();
      await seq.transaction(async (transaction) => {
        await markSeen(user, alert, transaction);
        await seq.query(
          `INSERT INTO alert_events (alert_id, action, actor_id, organization_id, response, note, created_at)
           VALUES (:alertId, 'answered', :userId, :orgId, :response, :note, :now)`,
          { replacements: { alertId: id, userId: user.id, orgId: user.organizationId, response: answer.response, note: answer.note, now }, transaction },
        );
        await seq.query(`UPDATE alerts SET state = 'answered', revision = nextval('alert_revisions'), updated_at = :now WHERE id = :id`, {
          replacements: { id, now }, transaction,
        });
      });
      await publishAlert(ctx, id, 'alert:updated');
      return load(user, id);
    },
  };
}
