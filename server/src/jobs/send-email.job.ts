// Worker for outgoing e-mail: services enqueue, this sends through SMTP; a failure
// throws so pg-boss retries it later.
import type { JobQueue } from './queue.js';
import { queueNames } from './queue-names.js';
import type { Mailer, OutgoingEmail } from '../mail/mailer.js';

export async function startEmailWorker(jobs: JobQueue, mailer: Mailer) {
  await jobs.addWorker<OutgoingEmail>(queueNames.sendEmail, (email) => mailer.send(email));
}

export function enqueueEmail(jobs: JobQueue, email: OutgoingEmail) {
  return jobs.send(queueNames.sendEmail, email);
}
