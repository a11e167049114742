// Queue names, in one place, with each queue's pg-boss policy: 'short' keeps at most one
// waiting job per singletonKey, so repeated changes to one spray or block collapse into one.
import type PgBoss from 'pg-boss';

export const queueNames = {
  sendEmail: 'email-send',
  invoiceReminders: 'invoice-overdue-reminders',
  invoiceEmail: 'invoice-email',
  bloomDigest: 'bloom-digest',
  conflictRecheck: 'conflict-recheck',
  alertPublish: 'alert-publish',
  idempotencyKeyPrune: 'idempotency-keys-prune',
} as const;

export type QueueName = (typeof queueNames)[keyof typeof queueNames];

export const queuePolicies: Partial<Record<QueueName, PgBoss.QueuePolicy>> = {
  [queueNames.conflictRecheck]: 'short',
};
