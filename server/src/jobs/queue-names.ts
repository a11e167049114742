// Queue names, in one place.
export const queueNames = {
  sendEmail: 'email-send',
  invoiceReminders: 'invoice-overdue-reminders',
  invoiceEmail: 'invoice-email',
  bloomDigest: 'bloom-digest',
} as const;

export type QueueName = (typeof queueNames)[keyof typeof queueNames];
