// The shape of one feature's permissions: each action lists the roles that may do it.
import type { RoleKey } from '../roles.js';

export type PolicyTable<Action extends string = string> = Readonly<Record<Action, readonly RoleKey[]>>;

export function isAllowed(table: PolicyTable, action: string, roleKey: RoleKey): boolean {
  return table[action]?.includes(roleKey) ?? false;
}
