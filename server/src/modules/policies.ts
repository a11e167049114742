// Every feature's policy table in one place, so the authorization test can check that
// each action has rows (tests/api/authz/*.rows.ts). Features add their table here.
import type { PolicyTable } from '../middleware/authenticate.js';
import { authPolicy } from './auth/auth.policy.js';
import { blocksPolicy } from './blocks/blocks.policy.js';
import { weatherPolicy } from './weather/weather.policy.js';
import { bloomPolicy } from './bloom/bloom.policy.js';
import { organizationPolicy } from './organization/organization.policy.js';
import { dashboardPolicy } from './dashboard/dashboard.policy.js';
import { adminPolicy } from './admin/admin.policy.js';
import { spraysPolicy } from './sprays/sprays.policy.js';
import { alertsPolicy } from './alerts/alerts.policy.js';
import { pestsPolicy } from './pests/pests.policy.js';
import { invoicesPolicy } from './invoices/invoices.policy.js';
import { paymentsPolicy } from './payments/payments.policy.js';
import { requestsPolicy } from './requests/requests.policy.js';
import { yardsPolicy } from './yards/yards.policy.js';
import { commitmentsPolicy } from './commitments/commitments.policy.js';
import { agreementsPolicy } from './agreements/agreements.policy.js';
import { placementsPolicy } from './placements/placements.policy.js';
import { calendarPolicy } from './calendar/calendar.policy.js';
import { exportsPolicy } from './exports/exports.policy.js';

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
