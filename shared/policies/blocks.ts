// Who may do what with blocks: the farm's owner and managers edit; every farm member reads.
import type { PolicyTable } from './policy-table.js';

export const blocksPolicy: PolicyTable<'list' | 'read' | 'create' | 'update' | 'delete' | 'forecast' | 'publishBloom'> = {
  list: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer'],
  read: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer'],
  create: ['farm:owner', 'farm:manager'],
  update: ['farm:owner', 'farm:manager'],
  delete: ['farm:owner', 'farm:manager'],
  forecast: ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer'],
  publishBloom: ['farm:owner', 'farm:manager'],
};
