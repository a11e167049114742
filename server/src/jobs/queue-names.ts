// Queue names, in one place.
export const queueNames = {
  sendEmail: 'email-send',
} as const;

export type QueueName = (typeof queueNames)[keyof typeof queueNames];
