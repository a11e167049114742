// Owners and managers of either side may export their season.
import type { PolicyTable } from './policy-table.js';

export const exportsPolicy = {
  export: ['farm:owner', 'farm:manager', 'apiary:owner', 'apiary:manager'],
} as const satisfies PolicyTable;
