// Who may do what with weather stations: the farm's owner and managers change stations and
// temperatures; every farm member reads them.
import type { PolicyTable } from './policy-table.js';

const farmMembers = ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer'] as const;
const farmEditors = ['farm:owner', 'farm:manager'] as const;

export const weatherPolicy: PolicyTable<'list' | 'read' | 'create' | 'update' | 'enterTemperatures' | 'uploadTemperatures' | 'enterForecastLows'> = {
  list: farmMembers,
  read: farmMembers,
  create: farmEditors,
  update: farmEditors,
  enterTemperatures: farmEditors,
  uploadTemperatures: farmEditors,
  enterForecastLows: farmEditors,
};
