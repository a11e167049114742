// Authorization rows for /api/dashboard and /api/admin: each side opens its own overview
// (scoped to its own organization, so another organization's owner gets its own, 200);
// every member opens the season timeline and map; only an apiary owner enters the colony
// total; only the platform admin opens the admin views.
import { apiaryMembers, each, farmMembers, statuses, type AuthzRow } from './authz-row.js';

const adminOnly = statuses(403, { admin: 200 });

export const rows: AuthzRow[] = [
  {
    title: "open the grower's season overview",
    method: 'GET',
    path: '/api/dashboard/grower',
    policy: { table: 'dashboard', action: 'viewGrower' },
    expect: statuses(403, { ...each(farmMembers, 200), 'other-farm': 200 }),
  },
  {
    title: "open the beekeeper's season overview",
    method: 'GET',
    path: '/api/dashboard/beekeeper',
    policy: { table: 'dashboard', action: 'viewBeekeeper' },
    expect: statuses(403, { ...each(apiaryMembers, 200), 'other-apiary': 200 }),
  },
  {
    title: 'enter the colonies the business has',
    method: 'PUT',
    path: '/api/dashboard/colonies-owned',
    body: { coloniesOwned: 120 },
    policy: { table: 'dashboard', action: 'setColoniesOwned' },
    expect: statuses(403, { 'apiary:owner': 200, 'other-apiary': 200 }),
  },
  {
    title: 'open the season timeline',
    method: 'GET',
    path: '/api/dashboard/timeline',
    policy: { table: 'dashboard', action: 'viewSeason' },
    expect: statuses(200, { admin: 403 }),
  },
  {
    title: 'open the season map',
    method: 'GET',
    path: '/api/dashboard/map',
    policy: { table: 'dashboard', action: 'viewSeason' },
    expect: statuses(200, { admin: 403 }),
  },
  { title: 'list organizations (admin)', method: 'GET', path: '/api/admin/organizations', policy: { table: 'admin', action: 'viewOrganizations' }, expect: adminOnly },
  { title: 'list users (admin)', method: 'GET', path: '/api/admin/users', policy: { table: 'admin', action: 'viewUsers' }, expect: adminOnly },
  { title: 'list sent e-mails (admin)', method: 'GET', path: '/api/admin/emails', policy: { table: 'admin', action: 'viewEmails' }, expect: adminOnly },
  { title: 'read queue health (admin)', method: 'GET', path: '/api/admin/queues', policy: { table: 'admin', action: 'viewQueues' }, expect: adminOnly },
];
