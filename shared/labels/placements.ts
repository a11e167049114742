// Placements (the colonies of one agreement at one drop site) and the field steps on them.
import { placementStates, type PlacementState } from '../schemas/placements.js';
import { labelSet } from './label-set.js';

export const placementStateSet = labelSet<PlacementState>('placement states', placementStates, {
  scheduled: 'Not yet dropped off',
  delivered: 'On site',
  'picked-up': 'Picked up',
});

export const fieldSteps = ['delivery', 'strength-check', 'pickup'] as const;
export type FieldStep = (typeof fieldSteps)[number];

export const fieldStepSet = labelSet<FieldStep>('field steps', fieldSteps, {
  delivery: 'Drop-off',
  'strength-check': 'Strength check',
  pickup: 'Pickup',
});
