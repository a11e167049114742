// What the season timeline and map show: the kinds of items and map features.
import type { MapFeatureKind, TimelineItemKind } from '../schemas/dashboard.js';
import { labelSet } from './label-set.js';

export const timelineItemKinds = ['bloom', 'placement', 'spray', 'alert'] as const satisfies readonly TimelineItemKind[];

export const timelineItemKindSet = labelSet<TimelineItemKind>('timeline items', timelineItemKinds, {
  bloom: 'Bloom',
  placement: 'Placement',
  spray: 'Spray',
  alert: 'Spray alert',
});

export const mapFeatureKinds = ['block', 'drop-site', 'yard', 'spray-buffer'] as const satisfies readonly MapFeatureKind[];

export const mapFeatureKindSet = labelSet<MapFeatureKind>('map features', mapFeatureKinds, {
  block: 'Block',
  'drop-site': 'Drop site',
  yard: 'Yard',
  'spray-buffer': 'Spray buffer',
});

/** Where a block's bloom stands today (the grower's overview). */
export const bloomStates = ['no-forecast', 'before-bloom', 'in-bloom', 'after-bloom'] as const;
export type BloomState = (typeof bloomStates)[number];

export const bloomStateSet = labelSet<BloomState>('bloom states', bloomStates, {
  'no-forecast': 'No forecast',
  'before-bloom': 'Before bloom',
  'in-bloom': 'In bloom',
  'after-bloom': 'Past petal fall',
});
