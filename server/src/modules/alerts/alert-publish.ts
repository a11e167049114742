// The worker that sends a changed alert over socket.io to the rooms of every organization it
// concerns, each with its own view of it (seen or not). It sends the alert as it is now, so
// a late or repeated job sends a revision the client already holds, which it drops. With
// the Postgres adapter the rooms span every server process.
import type { AppContext } from '../../context.js';
import { publishToOrganizations } from '../../realtime/publish.js';
import { queueNames } from '../../jobs/queue-names.js';
import { loadAlertDtos, organizationsOf } from './alert-dtos.js';
import type { AlertPublishJob } from './alert-outbox.js';

export async function publishAlert(ctx: AppContext, job: AlertPublishJob): Promise<void> {
  for (const orgId of await organizationsOf(ctx, job.alertId)) {
    const [dto] = await loadAlertDtos(ctx, orgId, { ids: [job.alertId] });
    if (dto) publishToOrganizations(ctx.io, [orgId], job.event, dto);
  }
}

export async function startAlertPublishWorker(ctx: AppContext): Promise<void> {
  await ctx.jobs.addWorker<AlertPublishJob>(queueNames.alertPublish, (job) => publishAlert(ctx, job));
}
