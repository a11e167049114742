// Authorization rows for /api/auth. Sign-in, sign-up, CSRF, sign-out and password reset
// are open to everyone; the current user and preferences need a signed-in user of any role.
import { buildOrganization, buildUser, defaultTestPassword } from '../../support/builders/accounts.js';
import { buildPasswordResetToken } from '../../support/builders/invitations.js';
import { statuses, type AuthzRow } from './authz-row.js';

let n = 0;
const uniqueEmail = (what: string) => `${what}-${Date.now().toString(36)}${(n++).toString(36)}@example.test`;

async function freshFarmUser() {
  const farm = await buildOrganization({ kind: 'farm' });
  return buildUser({ organization: farm, role: 'viewer', email: uniqueEmail('login') });
}

export const rows: AuthzRow[] = [
  { title: 'fetch a CSRF token', method: 'GET', path: '/api/auth/csrf', expect: statuses(200, { 'signed-out': 200 }) },
  { title: 'read the signed-in user', method: 'GET', path: '/api/auth/me', policy: { table: 'auth', action: 'viewSelf' }, expect: statuses(200) },
  {
    title: 'change own preferences',
    method: 'PATCH',
    path: '/api/auth/me/preferences',
    body: { units: 'imperial' },
    policy: { table: 'auth', action: 'updatePreferences' },
    expect: statuses(200),
  },
  {
    title: 'sign in with the right password',
    method: 'POST',
    path: '/api/auth/login',
    ownClient: true,
    fresh: async () => ({ email: (await freshFarmUser()).email }),
    body: ({ fresh }) => ({ email: fresh.email, password: defaultTestPassword }),
    expect: statuses(200, { 'signed-out': 200 }),
  },
  {
    title: 'sign in with a wrong password',
    method: 'POST',
    path: '/api/auth/login',
    fresh: async () => ({ email: (await freshFarmUser()).email }),
    body: ({ fresh }) => ({ email: fresh.email, password: 'not-the-password-1' }),
    expect: statuses(401),
  },
  {
    title: 'sign up a new farm',
    method: 'POST',
    path: '/api/auth/signup',
    ownClient: true,
    body: () => ({ name: 'New Grower', email: uniqueEmail('signup'), password: 'a-long-fresh-passphrase', organization: { name: 'New Farm', kind: 'farm' } }),
    expect: statuses(201, { 'signed-out': 201 }),
  },
  { title: 'sign out', method: 'POST', path: '/api/auth/logout', ownClient: true, expect: statuses(200, { 'signed-out': 200 }) },
  {
    title: 'ask for a password reset',
    method: 'POST',
    path: '/api/auth/password-reset',
    body: ({ world }) => ({ email: world.own.members['farm:viewer'].email }),
    expect: statuses(202, { 'signed-out': 202 }),
  },
  {
    title: 'set a new password with a reset token',
    method: 'POST',
    path: '/api/auth/password-reset/confirm',
    fresh: async () => ({ token: (await buildPasswordResetToken({ user: await freshFarmUser() })).token }),
    body: ({ fresh }) => ({ token: fresh.token, password: 'another-long-passphrase' }),
    expect: statuses(200, { 'signed-out': 200 }),
  },
];
