// Owners and managers of either side may export their season.
import type { PolicyTable } from '../../middleware/authenticate.js';

export const exportsPolicy = {
  export: ['farm:owner', 'farm:manager', 'apiary:owner', 'apiary:manager'],
} as const satisfies PolicyTable;
