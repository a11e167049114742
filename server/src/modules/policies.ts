// Every feature's policy table in one place, so the authorization test can check that
// each action has rows (tests/api/authz/*.rows.ts). Features add their table here.
import type { PolicyTable } from '../middleware/authenticate.js';
import { authPolicy } from './auth/auth.policy.js';
import { organizationPolicy } from './organization/organization.policy.js';
import { dashboardPolicy } from './dashboard/dashboard.policy.js';
import { adminPolicy } from './admin/admin.policy.js';
import { spraysPolicy } from './sprays/sprays.policy.js';
import { alertsPolicy } from './alerts/alerts.policy.js';
import { pestsPolicy } from './pests/pests.policy.js';
import { invoicesPolicy } from './invoices/invoices.policy.js';
import { paymentsPolicy } from './payments/payments.policy.js';

export const policyTables = {
  auth: authPolicy,
  organization: organizationPolicy,
  dashboard: dashboardPolicy,
  admin: adminPolicy,
  sprays: spraysPolicy,
  alerts: alertsPolicy,
  pests: pestsPolicy,
  invoices: invoicesPolicy,
  payments: paymentsPolicy,
} as const satisfies Record<string, PolicyTable>;

export type PolicyTableName = keyof typeof policyTables;
