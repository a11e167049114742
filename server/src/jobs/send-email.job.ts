// Worker for outgoing e-mail: services enqueue, this sends through SMTP; a failure
// throws so pg-boss retries it later.
import type { JobQueue, JobSendOptions } from './queue.js';
import { queueNames } from './queue-names.js';
import type { Mailer, OutgoingEmail } from '../mail/mailer.js';

export async function startEmailWorker(jobs: JobQueue, mailer: Mailer) {
  await jobs.addWorker<OutgoingEmail>(queueNames.sendEmail, (email) => mailer.send(email));
}

/** Pass `transaction` when the e-mail belongs to a change: it is then sent only if that change commits. */
export function enqueueEmail(jobs: JobQueue, email: OutgoingEmail, options?: Pick<JobSendOptions, 'transaction'>) {
  return jobs.send(queueNames.sendEmail, email, options);
}
