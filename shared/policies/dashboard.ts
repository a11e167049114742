// Who may open which overview: each side sees its own dashboard; the season timeline and
// map are open to every member of a farm or an apiary business; only the business owner
// enters how many colonies the business has.
import type { PolicyTable } from './policy-table.js';

export const dashboardPolicy = {
  viewGrower: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer'],
  viewBeekeeper: ['apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'],
  viewSeason: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer', 'apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'],
  setColoniesOwned: ['apiary:owner'],
} as const satisfies PolicyTable;
