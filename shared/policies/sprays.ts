// Who may see and plan a farm's sprays.
import type { PolicyTable } from './policy-table.js';

export const spraysPolicy = {
  list: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer'],
  plan: ['farm:owner', 'farm:manager', 'farm:applicator'],
} as const satisfies PolicyTable;
