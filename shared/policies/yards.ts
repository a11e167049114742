// Who may see and keep an apiary's yards.
import type { PolicyTable } from './policy-table.js';

export const yardsPolicy = {
  list: ['apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'],
  manage: ['apiary:owner', 'apiary:manager'],
} as const satisfies PolicyTable;
