// The worker that sends a changed alert over socket.io to the rooms of every organization it
// concerns, each with its own view of it (seen or not). It sends the alert as it is now, so
// a late or repeated job sends a revision the client already holds, which it drops. The
// process that committed a raised alert sends it at once as its transaction left it (seen
// by nobody yet, so one view serves every side) without reading it again. With the
// Postgres adapter the rooms span every server process.
import type { AppContext } from '../../context.js';
import { publishToOrganizations } from '../../realtime/publish.js';
import { queueNames } from '../../jobs/queue-names.js';
import { loadAlertDtos, organizationsOf } from './alert-dtos.js';
import type { AlertPublishJob } from './alert-outbox.js';
import type { AlertDto } from '../../../../shared/schemas/alerts.js';

export async function publishAlert(ctx: AppContext, job: AlertPublishJob): Promise<void> {
  const orgIds = await organizationsOf(ctx, job.alertId);
  const views = await Promise.all(orgIds.map((orgId) => loadAlertDtos(ctx, orgId, { ids: [job.alertId] })));
  orgIds.forEach((orgId, i) => {
    const [dto] = views[i];
    if (dto) publishToOrganizations(ctx.io, [orgId], job.event, dto);
  });
}

// Publications this process started right after their commit: whether each was sent. The
// job for one waits for that answer and sends only when the first attempt failed. A job
// fetched by another process finds nothing here and sends again (a duplicate the clients drop).
const sentOnCommit = new Map<string, Promise<boolean>>();
const forgetAfterMs = 10 * 60_000;

/** An alert nobody has seen yet looks the same to every organization it concerns. */
async function publishUnseen(ctx: AppContext, job: AlertPublishJob, alert: AlertDto): Promise<void> {
  publishToOrganizations(ctx.io, [alert.farm.id, ...(alert.apiary ? [alert.apiary.id] : [])], job.event, alert);
}

export function publishOnCommit(ctx: AppContext, job: AlertPublishJob, unseen?: AlertDto): void {
  if (!job.publicationId) return;
  const id = job.publicationId;
  const sent = (unseen && !unseen.seenByMe ? publishUnseen(ctx, job, unseen) : publishAlert(ctx, job)).then(
    () => true,
    (err) => {
      ctx.logger.warn({ err, alertId: job.alertId }, 'alert not published on commit; its job will');
      return false;
    },
  );
  sentOnCommit.set(id, sent);
  setTimeout(() => sentOnCommit.delete(id), forgetAfterMs).unref();
}

async function publishFromJob(ctx: AppContext, job: AlertPublishJob): Promise<void> {
  const first = job.publicationId ? sentOnCommit.get(job.publicationId) : undefined;
  if (first) {
    sentOnCommit.delete(job.publicationId!);
    if (await first) return;
  }
  await publishAlert(ctx, job);
}

export async function startAlertPublishWorker(ctx: AppContext): Promise<void> {
  await ctx.jobs.addWorker<AlertPublishJob>(queueNames.alertPublish, (job) => publishFromJob(ctx, job));
}
