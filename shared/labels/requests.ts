// Hive requests, the commitments beekeepers offer, and the history kept for each request.
import { requestStates, commitmentStates, type RequestState, type CommitmentState } from '../schemas/requests.js';
import { labelSet } from './label-set.js';

export const requestStateSet = labelSet<RequestState>('hive request states', requestStates, {
  draft: 'Draft',
  listed: 'Open for commitments',
  filled: 'Fully committed',
  closed: 'Closed',
  withdrawn: 'Withdrawn',
});

export const commitmentStateSet = labelSet<CommitmentState>('commitment states', commitmentStates, {
  offered: 'Offered',
  accepted: 'Accepted',
  declined: 'Declined',
  withdrawn: 'Withdrawn',
});

/** Every entry the request history records (hive_request_events.action). */
export const requestEventActions = [
  'created', 'edited', 'opened', 'withdrawn', 'closed', 'fully-committed', 'reopened',
  'commitment-offered', 'commitment-withdrawn', 'price-accepted', 'price-declined',
  'agreement-drafted', 'agreement-confirmed', 'agreement-in-force',
  'amendment-proposed', 'amendment-accepted', 'amendment-rejected', 'amendment-withdrawn',
  'placement-delivered', 'placement-picked-up', 'strength-checked', 'count-disputed',
] as const;
export type RequestEventAction = (typeof requestEventActions)[number];

export const requestEventSet = labelSet<RequestEventAction>('hive request history', requestEventActions, {
  created: 'Request drafted',
  edited: 'Request changed',
  opened: 'Opened for commitments',
  withdrawn: 'Request withdrawn',
  closed: 'Request closed',
  'fully-committed': 'Fully committed',
  reopened: 'Open again for commitments',
  'commitment-offered': 'Colonies offered',
  'commitment-withdrawn': 'Offer withdrawn',
  'price-accepted': 'Offer accepted',
  'price-declined': 'Offer declined',
  'agreement-drafted': 'Agreement drawn up',
  'agreement-confirmed': 'Agreement confirmed by one side',
  'agreement-in-force': 'Agreement confirmed by both sides',
  'amendment-proposed': 'Change to the agreement proposed',
  'amendment-accepted': 'Change to the agreement accepted',
  'amendment-rejected': 'Change to the agreement turned down',
  'amendment-withdrawn': 'Change to the agreement withdrawn',
  'placement-delivered': 'Colonies dropped off',
  'placement-picked-up': 'Colonies picked up',
  'strength-checked': 'Strength check recorded',
  'count-disputed': 'Colony count disputed',
});
