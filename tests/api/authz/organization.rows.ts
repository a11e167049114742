// Authorization rows for /api/organization: every member may list their organization's
// members; only owners manage members and invitations, and only in their own
// organization (another organization's member or invitation answers 404).
import { buildUser } from '../../support/builders/accounts.js';
import { buildInvitation } from '../../support/builders/invitations.js';
import { each, otherOrganizations, statuses, type AuthzRow, type AuthzWorld } from './authz-row.js';

let n = 0;
const uniqueEmail = (what: string) => `${what}-${Date.now().toString(36)}${(n++).toString(36)}@example.test`;

const newFarmMember = async ({ world }: { world: AuthzWorld }) => ({ id: (await buildUser({ organization: world.own.farm, role: 'viewer' })).id });
const newApiaryMember = async ({ world }: { world: AuthzWorld }) => ({ id: (await buildUser({ organization: world.own.apiary, role: 'viewer' })).id });

/** Owners may act, but only on their own organization's rows: 200 for the owner of the row's organization, 404 for other owners. */
const ownerOfFarmOnly = (status: number) => statuses(403, { 'farm:owner': status, 'apiary:owner': 404, ...each(otherOrganizations, 404) });
const ownerOfApiaryOnly = (status: number) => statuses(403, { 'apiary:owner': status, 'farm:owner': 404, ...each(otherOrganizations, 404) });
const anyOwner = (status: number) => statuses(403, { ...each(['farm:owner', 'apiary:owner', ...otherOrganizations], status) });

export const rows: AuthzRow[] = [
  {
    title: 'list the members of the own organization',
    method: 'GET',
    path: '/api/organization/members',
    policy: { table: 'organization', action: 'listMembers' },
    expect: statuses(200, { admin: 403 }),
  },
  {
    title: 'change the role of a farm member',
    method: 'PATCH',
    path: ({ fresh }) => `/api/organization/members/${fresh.id}`,
    body: { role: 'manager' },
    fresh: newFarmMember,
    policy: { table: 'organization', action: 'changeRole' },
    expect: ownerOfFarmOnly(200),
  },
  {
    title: 'change the role of an apiary member',
    method: 'PATCH',
    path: ({ fresh }) => `/api/organization/members/${fresh.id}`,
    body: { role: 'crew' },
    fresh: newApiaryMember,
    policy: { table: 'organization', action: 'changeRole' },
    expect: ownerOfApiaryOnly(200),
  },
  {
    title: 'remove a farm member',
    method: 'DELETE',
    path: ({ fresh }) => `/api/organization/members/${fresh.id}`,
    fresh: newFarmMember,
    policy: { table: 'organization', action: 'removeMember' },
    expect: ownerOfFarmOnly(200),
  },
  {
    title: 'remove an apiary member',
    method: 'DELETE',
    path: ({ fresh }) => `/api/organization/members/${fresh.id}`,
    fresh: newApiaryMember,
    policy: { table: 'organization', action: 'removeMember' },
    expect: ownerOfApiaryOnly(200),
  },
  {
    title: 'list open invitations',
    method: 'GET',
    path: '/api/organization/invitations',
    policy: { table: 'organization', action: 'listInvitations' },
    expect: anyOwner(200),
  },
  {
    title: 'invite someone as a viewer',
    method: 'POST',
    path: '/api/organization/invitations',
    body: () => ({ email: uniqueEmail('invitee'), role: 'viewer' }),
    policy: { table: 'organization', action: 'invite' },
    expect: anyOwner(201),
  },
  {
    title: 'withdraw an invitation to the farm',
    method: 'DELETE',
    path: ({ fresh }) => `/api/organization/invitations/${fresh.id}`,
    fresh: async ({ world }) => ({ id: (await buildInvitation({ organization: world.own.farm })).invitation.id }),
    policy: { table: 'organization', action: 'revokeInvitation' },
    expect: ownerOfFarmOnly(200),
  },
  {
    title: 'withdraw an invitation to the apiary business',
    method: 'DELETE',
    path: ({ fresh }) => `/api/organization/invitations/${fresh.id}`,
    fresh: async ({ world }) => ({ id: (await buildInvitation({ organization: world.own.apiary, role: 'crew' })).invitation.id }),
    policy: { table: 'organization', action: 'revokeInvitation' },
    expect: ownerOfApiaryOnly(200),
  },
  {
    title: 'look at an invitation by its token',
    method: 'POST',
    path: '/api/organization/invitations/preview',
    fresh: async ({ world }) => ({ token: (await buildInvitation({ organization: world.own.farm })).token }),
    body: ({ fresh }) => ({ token: fresh.token }),
    expect: statuses(200, { 'signed-out': 200 }),
  },
  {
    title: 'accept an invitation',
    method: 'POST',
    path: '/api/organization/invitations/accept',
    ownClient: true,
    fresh: async ({ world }) => ({ token: (await buildInvitation({ organization: world.own.apiary, role: 'crew' })).token }),
    body: ({ fresh }) => ({ token: fresh.token, name: 'New Crew Member', password: 'a-long-fresh-passphrase' }),
    expect: statuses(201, { 'signed-out': 201 }),
  },
];
