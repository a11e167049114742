// Who may move money: the grower's owner or manager pays online; the beekeeper's owner or
// manager records cheques and transfers and refunds online payments.
import type { PolicyTable } from './policy-table.js';

export const paymentsPolicy = {
  payOnline: ['farm:owner', 'farm:manager'],
  recordManual: ['apiary:owner', 'apiary:manager'],
  refund: ['apiary:owner', 'apiary:manager'],
  export: ['apiary:owner', 'apiary:manager', 'apiary:viewer', 'farm:owner', 'farm:manager', 'farm:viewer'],
} as const satisfies PolicyTable;
