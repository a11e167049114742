// Who may read and answer the conflict alerts of their organization.
import type { PolicyTable } from './policy-table.js';

export const alertsPolicy = {
  list: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer', 'apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'],
  answer: ['farm:owner', 'farm:manager', 'farm:applicator', 'apiary:owner', 'apiary:manager', 'apiary:crew'],
} as const satisfies PolicyTable;
