// Who may do what with bloom reference data and bloom windows. Stage thresholds: every
// farm member and the admin read them; farm owners/managers keep their farm's own; the
// platform admin edits the published defaults and the frost critical temperatures.
// Beekeepers read the current bloom windows of blocks they hold or offer colonies for.
import type { PolicyTable } from './policy-table.js';

export const bloomPolicy: PolicyTable<'readReference' | 'editFarmThresholds' | 'editPublishedReference' | 'heldWindows'> = {
  readReference: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer', 'admin'],
  editFarmThresholds: ['farm:owner', 'farm:manager', 'admin'],
  editPublishedReference: ['admin'],
  heldWindows: ['apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'],
};
