// Agreements, their amendments and the terms an amendment may change.
import { agreementStates, amendmentChanges, type AgreementState, type AmendmentChanges } from '../schemas/agreements.js';
import { labelSet } from './label-set.js';

export const agreementStateSet = labelSet<AgreementState>('agreement states', agreementStates, {
  'awaiting-signatures': 'Waiting for both sides',
  'in-force': 'Confirmed by both',
  completed: 'Completed',
  cancelled: 'Cancelled',
});

export const amendmentStates = ['proposed', 'accepted', 'rejected', 'withdrawn'] as const;
export type AmendmentState = (typeof amendmentStates)[number];

export const amendmentStateSet = labelSet<AmendmentState>('amendment states', amendmentStates, {
  proposed: 'Waiting for the other side',
  accepted: 'Accepted',
  rejected: 'Turned down',
  withdrawn: 'Withdrawn',
});

/** The terms an amendment may change (the keys of the amendment schema). */
export const amendmentTerms = Object.keys(amendmentChanges.shape) as (keyof AmendmentChanges)[];
export type AmendmentTerm = keyof AmendmentChanges;

export const amendmentTermSet = labelSet<AmendmentTerm>('amendment terms', amendmentTerms, {
  pricePerColonyCents: 'Price per colony',
  expectedOnSite: 'Expected on site',
  noticeHours: 'Spray notice (hours)',
  removalNoticeHours: 'Notice before removal (hours)',
  minFramesOfBees: 'Minimum frames of bees',
  extraMoveFeeCents: 'Fee per extra move',
});
