// Who may see and record a farm's trap counts.
import type { PolicyTable } from './policy-table.js';

export const pestsPolicy = {
  list: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer'],
  record: ['farm:owner', 'farm:manager', 'farm:applicator'],
} as const satisfies PolicyTable;
