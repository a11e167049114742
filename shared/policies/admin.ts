// The platform admin's read-only views: only the admin role opens them.
import type { PolicyTable } from './policy-table.js';

export const adminPolicy = {
  viewOrganizations: ['admin'],
  viewUsers: ['admin'],
  viewEmails: ['admin'],
  viewQueues: ['admin'],
} as const satisfies PolicyTable;
