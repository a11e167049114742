// The background queue's job states as the admin's queue table shows them.
import { labelSet } from './label-set.js';

/** The states the job queue (pg-boss 10) gives a job. */
export const jobStates = ['created', 'retry', 'active', 'completed', 'cancelled', 'failed'] as const;
export type JobState = (typeof jobStates)[number];

export const jobStateSet = labelSet<JobState>('queue job states', jobStates, {
  created: 'Waiting',
  retry: 'Waiting to try again',
  active: 'Running',
  completed: 'Done',
  cancelled: 'Cancelled',
  failed: 'Failed',
});

/** The background queues (server/src/jobs/queue-names.ts). */
export const queueCodes = ['email-send', 'invoice-overdue-reminders', 'invoice-email', 'bloom-digest', 'conflict-recheck', 'alert-publish', 'idempotency-keys-prune'] as const;
export type QueueCode = (typeof queueCodes)[number];

export const queueSet = labelSet<QueueCode>('background queues', queueCodes, {
  'email-send': 'E-mails to send',
  'invoice-overdue-reminders': 'Overdue invoice reminders',
  'invoice-email': 'Invoices to e-mail',
  'bloom-digest': 'Bloom window digests',
  'conflict-recheck': 'Spray conflict re-checks',
  'alert-publish': 'Spray alerts to announce',
  'idempotency-keys-prune': 'Old field-record keys to clear',
});
