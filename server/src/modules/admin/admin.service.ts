// What the platform admin looks at: organizations and their member counts, users, the
// e-mails the outgoing mail server received (read from the SMTP sink's HTTP API), and the
// job queue's health (jobs per queue and state, read from pg-boss's own tables).
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../../context.js';
import { createError } from '../../errors/create-error.js';
import type { AdminEmail, AdminOrganization, AdminQueue, AdminQueueHealth, AdminUser } from '../../../../shared/schemas/dashboard.js';

export function createAdminService(ctx: AppContext) {
  const select = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
    ctx.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });

  return {
    async organizations(): Promise<AdminOrganization[]> {
      const rows = await select<{ id: string; name: string; kind: 'farm' | 'apiary'; time_zone: string; members: number; created_at: Date }>(
        `SELECT o.id, o.name, o.kind, o.time_zone, count(u.id)::int AS members, o.created_at
         FROM organizations o LEFT JOIN users u ON u.organization_id = o.id
         GROUP BY o.id ORDER BY o.kind, o.name`,
      );
      return rows.map((r) => ({ id: r.id, name: r.name, kind: r.kind, timeZone: r.time_zone, members: r.members, createdAt: new Date(r.created_at).toISOString() }));
    },

    async users(): Promise<AdminUser[]> {
      const rows = await select<{ id: string; name: string; email: string; role: string; organization_name: string | null; disabled_at: Date | null; created_at: Date }>(
        `SELECT u.id, u.name, u.email, u.role, o.name AS organization_name, u.disabled_at, u.created_at
         FROM users u LEFT JOIN organizations o ON o.id = u.organization_id
         ORDER BY o.name NULLS FIRST, u.name`,
      );
      return rows.map((r) => ({
        id: r.id, name: r.name, email: r.email, role: r.role, organizationName: r.organization_name, disabled: r.disabled_at !== null,
        createdAt: new Date(r.created_at).toISOString(),
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
      const [present] = await select<{ ok: boolean }>(`SELECT to_regclass('pgboss.job') IS NOT NULL AS ok`);
      if (!present.ok) return { running: ctx.jobs.boss !== null, queues: [] };
      const rows = await select<{ name: string; state: string; jobs: number; oldest_waiting: Date | null }>(
        `SELECT q.name, j.state::text AS state, count(j.id)::int AS jobs,
           min(j.created_on) FILTER (WHERE j.state IN ('created', 'retry')) AS oldest_waiting
         FROM pgboss.queue q LEFT JOIN pgboss.job j ON j.name = q.name
         GROUP BY q.name, j.state ORDER BY q.name`,
      );
      const byName = new Map<string, AdminQueue>();
      for (const r of rows) {
        const queue = byName.get(r.name) ?? { name: r.name, states: {}, oldestWaitingAt: null };
        if (r.state) queue.states[r.state] = r.jobs;
        if (r.oldest_waiting) queue.oldestWaitingAt = new Date(r.oldest_waiting).toISOString();
        byName.set(r.name, queue);
      }
      return { running: ctx.jobs.boss !== null, queues: [...byName.values()] };
    },
  };
}

export type AdminService = ReturnType<typeof createAdminService>;
