// Every member of a farm or an apiary may have a private calendar feed.
import type { PolicyTable } from './policy-table.js';

export const calendarPolicy = {
  manage: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer', 'apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'],
} as const satisfies PolicyTable;
