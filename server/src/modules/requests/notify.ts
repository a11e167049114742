// Tells organizations about a change: a socket event to their rooms at once, and an
// e-mail to their owners and managers (and field crew when asked) through the queue.
import type { AppContext } from '../../context.js';
import { enqueueEmail } from '../../jobs/send-email.job.js';
import { publishToOrganizations } from '../../realtime/publish.js';
import type { ServerToClientEvents } from '../../../../shared/events.js';

export async function mailOrganizations(ctx: AppContext, organizationIds: string[], mail: { subject: string; text: string; includeCrew?: boolean }) {
  if (!organizationIds.length) return;
  const roles = mail.includeCrew ? ['owner', 'manager', 'crew'] : ['owner', 'manager'];
  const people = await ctx.models.User.findAll({ attributes: ['email'], where: { organizationId: organizationIds, role: roles, disabledAt: null } });
  const link = `${ctx.config.publicUrl}`;
  for (const person of people) {
    await enqueueEmail(ctx.jobs, { to: person.email, subject: mail.subject, text: `${mail.text}\n\nOpen Pollenpact: ${link}` });
  }
}

export function publish<E extends keyof ServerToClientEvents>(ctx: AppContext, organizationIds: string[], event: E, ...payload: Parameters<ServerToClientEvents[E]>) {
  publishToOrganizations(ctx.io, organizationIds, event, ...payload);
}

/** Every apiary business: open requests are told to all of them. */
export async function apiaryIds(ctx: AppContext): Promise<string[]> {
  return (await ctx.models.Organization.findAll({ attributes: ['id'], where: { kind: 'apiary' } })).map((o) => o.id);
}
