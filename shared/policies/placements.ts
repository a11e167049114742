// Who may do each field step: the apiary's crew, managers and owner deliver, check and
// pick up; the grower's owner or manager (or the grower's inspector) may record a
// strength check and dispute a count.
import type { PolicyTable } from './policy-table.js';

export const placementsPolicy = {
  read: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer', 'apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'],
  fieldStep: ['apiary:owner', 'apiary:manager', 'apiary:crew'],
  strengthCheck: ['apiary:owner', 'apiary:manager', 'apiary:crew', 'farm:owner', 'farm:manager'],
  dispute: ['farm:owner', 'farm:manager'],
} as const satisfies PolicyTable;
