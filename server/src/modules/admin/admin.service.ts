// What the platform admin looks at: organizations and their member counts, users, the
// e-mails the outgoing mail server received (read from the SMTP sink's HTTP API), and the
// job queue's health (jobs per queue and state, read from pg-boss's own tables).
import { cast, col, fn } from 'sequelize';
import type { AppContext } from '../../context.js';
import { createError } from '../../errors/create-error.js';
import { failingJobs, queueStates, queueTablesExist } from './admin.queries.js';
import type { AdminEmail, AdminOrganization, AdminQueue, AdminQueueHealth, AdminUser } from '../../../../shared/schemas/dashboard.js';

export function createAdminService(ctx: AppContext) {
  const { Organization, User } = ctx.models;

  return {
    async organizations(): Promise<AdminOrganization[]> {
      const rows = await Organization.findAll({
        attributes: ['id', 'name', 'kind', 'timeZone', 'createdAt', [cast(fn('count', col('members.id')), 'integer'), 'memberCount']],
        include: [{ model: User, as: 'members', attributes: [] }],
        group: ['Organization.id'],
        order: [['kind', 'ASC'], ['name', 'ASC']],
      });
      return rows.map((o) => ({
        id: o.id, name: o.name, kind: o.kind, timeZone: o.timeZone, members: o.get('memberCount') as number, createdAt: o.createdAt.toISOString(),
      }));
    },

    async users(): Promise<AdminUser[]> {
      const rows = await User.findAll({
        include: [{ model: Organization, as: 'organization', attributes: ['name'] }],
        order: [[{ model: Organization, as: 'organization' }, 'name', 'ASC NULLS FIRST'], ['name', 'ASC']],
      });
      return rows.map((u) => ({
        id: u.id, name: u.name, email: u.email, role: u.role, organizationName: u.organization?.name ?? null, disabled: u.disabledAt !== null,
        createdAt: u.createdAt.toISOString(),
      }));
    },

    async emails(): Promise<AdminEmail[]> {
      let body: { messages: Array<{ id: number; to: string[]; subject: string; receivedAt: string; attachments: unknown[] }> };
      try {
        const res = await fetch(`${ctx.config.mail.sinkUrl}/messages`, { signal: AbortSignal.timeout(3_000) });
        if (!res.ok) throw new Error(`sink answered ${res.status}`);
        body = (await res.json()) as typeof body;
      } catch (err) {
        ctx.logger.warn({ err }, 'mail sink unreachable');
        throw createError('unavailable', 'The e-mail sink cannot be reached right now.', 503);
      }
      return body.messages
        .map((m) => ({ id: m.id, to: m.to, subject: m.subject, receivedAt: m.receivedAt, attachments: m.attachments.length }))
        .sort((a, b) => b.id - a.id);
    },

    async queues(): Promise<AdminQueueHealth> {
      if (!(await queueTablesExist(ctx.sequelize))) return { running: ctx.jobs.boss !== null, queues: [], failing: [] };
      const rows = await queueStates(ctx.sequelize);
      const byName = new Map<string, AdminQueue>();
      for (const r of rows) {
        const queue = byName.get(r.name) ?? { name: r.name, states: {}, oldestWaitingAt: null };
        if (r.state) queue.states[r.state] = r.jobs;
        if (r.oldest_waiting) queue.oldestWaitingAt = new Date(r.oldest_waiting).toISOString();
        byName.set(r.name, queue);
      }
      const failing = (await failingJobs(ctx.sequelize)).map((j) => ({
        queue: j.name, id: j.id, state: j.state as 'retry' | 'failed', tries: j.retry_count, retryLimit: j.retry_limit,
        error: j.output?.message ?? null, at: new Date(j.at).toISOString(),
      }));
      return { running: ctx.jobs.boss !== null, queues: [...byName.values()], failing };
    },
  };
}

export type AdminService = ReturnType<typeof createAdminService>;
