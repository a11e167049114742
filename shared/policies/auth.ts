// Who may use the account routes that need a signed-in user: everyone signed in.
// Sign-up, sign-in, CSRF, password reset and invitation acceptance are public.
import type { PolicyTable } from './policy-table.js';
import { allRoleKeys } from '../roles.js';

export const authPolicy = {
  viewSelf: allRoleKeys,
  updatePreferences: allRoleKeys,
} as const satisfies PolicyTable;
