// Who may commit colonies (an apiary's owners and managers) and who answers (a farm's).
import type { PolicyTable } from './policy-table.js';

export const commitmentsPolicy = {
  list: ['apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'],
  offer: ['apiary:owner', 'apiary:manager'],
  withdraw: ['apiary:owner', 'apiary:manager'],
  decide: ['farm:owner', 'farm:manager'],
} as const satisfies PolicyTable;
