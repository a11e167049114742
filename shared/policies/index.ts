// Who may do what, written once: the server's allow() guards routes with these tables and
// the client's useCan() shows or hides the matching buttons and pages. Only the server decides.
import type { RoleKey } from '../roles.js';
import { isAllowed, type PolicyTable } from './policy-table.js';
import { authPolicy } from './auth.js';
import { blocksPolicy } from './blocks.js';
import { weatherPolicy } from './weather.js';
import { bloomPolicy } from './bloom.js';
import { organizationPolicy } from './organization.js';
import { dashboardPolicy } from './dashboard.js';
import { adminPolicy } from './admin.js';
import { spraysPolicy } from './sprays.js';
import { alertsPolicy } from './alerts.js';
import { pestsPolicy } from './pests.js';
import { invoicesPolicy } from './invoices.js';
import { paymentsPolicy } from './payments.js';
import { requestsPolicy } from './requests.js';
import { yardsPolicy } from './yards.js';
import { commitmentsPolicy } from './commitments.js';
import { agreementsPolicy } from './agreements.js';
import { placementsPolicy } from './placements.js';
import { calendarPolicy } from './calendar.js';
import { exportsPolicy } from './exports.js';

export { isAllowed, type PolicyTable };

export const policyTables = {
  auth: authPolicy,
  blocks: blocksPolicy,
  weather: weatherPolicy,
  bloom: bloomPolicy,
  organization: organizationPolicy,
  dashboard: dashboardPolicy,
  admin: adminPolicy,
  sprays: spraysPolicy,
  alerts: alertsPolicy,
  pests: pestsPolicy,
  invoices: invoicesPolicy,
  payments: paymentsPolicy,
  requests: requestsPolicy,
  yards: yardsPolicy,
  commitments: commitmentsPolicy,
  agreements: agreementsPolicy,
  placements: placementsPolicy,
  calendar: calendarPolicy,
  exports: exportsPolicy,
} as const satisfies Record<string, PolicyTable>;

export type PolicyTableName = keyof typeof policyTables;

/** Every action as 'table.action', e.g. 'sprays.plan'. */
export type PolicyAction = {
  [T in PolicyTableName]: `${T}.${Extract<keyof (typeof policyTables)[T], string>}`;
}[PolicyTableName];

/** The roles allowed one action. */
export function rolesFor(action: PolicyAction): readonly RoleKey[] {
  const [table, name] = action.split('.') as [PolicyTableName, string];
  return (policyTables[table] as PolicyTable)[name] ?? [];
}

export function can(roleKey: RoleKey | null | undefined, action: PolicyAction): boolean {
  if (!roleKey) return false;
  const [table, name] = action.split('.') as [PolicyTableName, string];
  return isAllowed(policyTables[table], name, roleKey);
}
