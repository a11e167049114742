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
