// The alert outbox: the jobs that publish a changed alert to the sockets of every
// organization it concerns and e-mail a raised one, written in the same transaction as the
// alert rows and their history. They exist exactly when the change is committed; the
// queue delivers them at least once (clients drop an alert revision they already hold).
// The process that committed also publishes at once, without waiting for a worker to fetch
// the job; the job then only publishes what that first attempt did not (alert-publish.ts).
import { randomUUID } from 'node:crypto';
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import { queueNames } from '../../jobs/queue-names.js';
import type { AlertDto } from '../../../../shared/schemas/alerts.js';
import { alertEmail, alertRecipients } from './alert-emails.js';
import { publishOnCommit } from './alert-publish.js';

export type AlertEventName = 'alert:raised' | 'alert:updated';

export interface AlertPublishJob {
  alertId: string;
  event: AlertEventName;
  /** Names this publication, so the job knows whether the committing process already sent it. */
  publicationId?: string;
}

/**
 * `unseen`: the alert as this transaction leaves it, when nobody has seen it yet (raised or
 * reopened); the committing process then sends it without reading it again.
 */
export async function queueAlertPublication(ctx: AppContext, transaction: Transaction, alertId: string, event: AlertEventName, unseen?: AlertDto): Promise<void> {
  const job: AlertPublishJob = { alertId, event, publicationId: randomUUID() };
  await ctx.jobs.send<AlertPublishJob>(queueNames.alertPublish, job, { transaction: { sequelize: ctx.sequelize, transaction } });
  transaction.afterCommit(() => publishOnCommit(ctx, job, unseen));
}

/** One e-mail job per person to tell (see alert-emails.ts), in the caller's transaction. */
export async function queueAlertEmails(ctx: AppContext, transaction: Transaction, alert: AlertDto): Promise<number> {
  const people = await alertRecipients(ctx, alert, transaction);
  const email = alertEmail(ctx, alert);
  await ctx.jobs.sendAll(queueNames.sendEmail, people.map((to) => ({ to, ...email })), { transaction: { sequelize: ctx.sequelize, transaction } });
  return people.length;
}
