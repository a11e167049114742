// Who may do what with hive requests: growers' owners and managers ask; every member of a
// farm sees its own requests; every member of an apiary sees requests open to it.
import type { PolicyTable } from './policy-table.js';

export const requestsPolicy = {
  list: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer', 'apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'],
  read: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer', 'apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'],
  manage: ['farm:owner', 'farm:manager'],
} as const satisfies PolicyTable;
