// Who may see, confirm and amend agreements: every member of either party sees them; the
// owners and managers of each side confirm and amend.
import type { PolicyTable } from './policy-table.js';

export const agreementsPolicy = {
  read: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer', 'apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'],
  confirm: ['farm:owner', 'farm:manager', 'apiary:owner', 'apiary:manager'],
  amend: ['farm:owner', 'farm:manager', 'apiary:owner', 'apiary:manager'],
} as const satisfies PolicyTable;
