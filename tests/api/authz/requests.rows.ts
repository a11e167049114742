// Authorization rows for hive requests, yards, commitments, agreements, placements, the
// calendar and exports. Another organization's request, agreement or placement answers
// 404; a role the policy leaves out answers 403 before anything is looked up.
import { buildBlock, buildRequest, buildDropSite, buildCommitment, buildAgreement, buildPlacement } from '../../support/builders/season.js';
import { each, statuses, type AuthzRow, type AuthzWorld } from './authz-row.js';

const onSite = { from: new Date('2027-04-10T07:00:00Z'), to: new Date('2027-05-01T07:00:00Z') };

interface Fixtures {
  blockId: string;
  requestId: string;
  agreementId: string;
  placementId: string;
}

async function listedRequest(world: AuthzWorld) {
  const block = await buildBlock({ farm: world.own.farm, crop: 'apple' });
  const request = await buildRequest({ farm: world.own.farm, blocks: [{ block, colonies: 40 }], state: 'listed', onSite });
  const dropSite = await buildDropSite({ request, block, lon: -119.9, lat: 44.9, coloniesPlanned: 40, gateCode: '1234' });
  return { block, request, dropSite };
}

async function agreementWith(world: AuthzWorld, state: 'awaiting-signatures' | 'in-force', placement?: 'scheduled' | 'delivered') {
  const { request, dropSite } = await listedRequest(world);
  const commitment = await buildCommitment({ request, apiary: world.own.apiary, colonies: 10 });
  const agreement = await buildAgreement({ commitment, state });
  const built = placement
    ? await buildPlacement({ agreement, dropSite, coloniesPlanned: 10, ...(placement === 'delivered' ? { deliveredAt: new Date(Date.now() - 3_600_000) } : {}) })
    : null;
  return { requestId: request.id, commitmentId: commitment.id, agreementId: agreement.id, placementId: built?.id ?? '' };
}

const farmManagers = ['farm:owner', 'farm:manager'] as const;
const apiaryManagers = ['apiary:owner', 'apiary:manager'] as const;
const apiaryMembers = ['apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'] as const;

export async function setup(world: AuthzWorld): Promise<Fixtures> {
  const { block, request } = await listedRequest(world);
  const a = await agreementWith(world, 'in-force', 'delivered');
  return { blockId: block.id, requestId: request.id, agreementId: a.agreementId, placementId: a.placementId };
}

export const rows: AuthzRow<Fixtures>[] = [
  {
    title: 'list hive requests (own farm, or open ones for beekeepers)',
    method: 'GET',
    path: '/api/requests',
    policy: { table: 'requests', action: 'list' },
    expect: statuses(200, { admin: 403 }),
  },
  {
    title: 'read an open request of the own farm (every apiary sees open requests)',
    method: 'GET',
    path: ({ fixtures }) => `/api/requests/${fixtures.requestId}`,
    policy: { table: 'requests', action: 'read' },
    expect: statuses(200, { admin: 403, 'other-farm': 404 }),
  },
  {
    title: 'ask for colonies on an own block (another farm cannot use it: 400 on the block)',
    method: 'POST',
    path: '/api/requests',
    body: ({ fixtures }) => ({
      title: 'Authz request', blocks: [{ blockId: fixtures.blockId, colonies: 5 }], minFramesOfBees: 6, arrive: { rule: 'date', on: '2027-04-10' },
      depart: { rule: 'date', on: '2027-04-30' }, pricePerColonyCents: 6000,
    }),
    policy: { table: 'requests', action: 'manage' },
    expect: statuses(403, { ...each(farmManagers, 201), 'other-farm': 400 }),
  },
  {
    title: 'close an open request',
    method: 'POST',
    fresh: async ({ world }) => ({ id: (await listedRequest(world)).request.id }),
    path: ({ fresh }) => `/api/requests/${fresh.id}/close`,
    policy: { table: 'requests', action: 'manage' },
    expect: statuses(403, { ...each(farmManagers, 200), 'other-farm': 404 }),
  },
  {
    title: 'commit colonies to an open request',
    method: 'POST',
    fresh: async ({ world }) => ({ id: (await listedRequest(world)).request.id }),
    path: ({ fresh }) => `/api/requests/${fresh.id}/commitments`,
    body: { colonies: 5 },
    policy: { table: 'commitments', action: 'offer' },
    expect: statuses(403, { ...each(apiaryManagers, 201), 'other-apiary': 201 }),
  },
  {
    title: 'list the own apiary’s commitments',
    method: 'GET',
    path: '/api/commitments',
    policy: { table: 'commitments', action: 'list' },
    expect: statuses(403, { ...each(apiaryMembers, 200), 'other-apiary': 200 }),
  },
  {
    title: 'withdraw an own commitment',
    method: 'POST',
    fresh: async ({ world }) => {
      const { request } = await listedRequest(world);
      return { id: (await buildCommitment({ request, apiary: world.own.apiary, colonies: 5 })).id };
    },
    path: ({ fresh }) => `/api/commitments/${fresh.id}/withdraw`,
    policy: { table: 'commitments', action: 'withdraw' },
    expect: statuses(403, { ...each(apiaryManagers, 200), 'other-apiary': 404 }),
  },
  {
    title: 'accept a beekeeper’s price offer on an own request',
    method: 'POST',
    fresh: async ({ world }) => {
      const { request } = await listedRequest(world);
      return { id: (await buildCommitment({ request, apiary: world.own.apiary, colonies: 5, state: 'offered', proposedPriceCents: 9100 })).id };
    },
    path: ({ fresh }) => `/api/commitments/${fresh.id}/accept`,
    policy: { table: 'commitments', action: 'decide' },
    expect: statuses(403, { ...each(farmManagers, 200), 'other-farm': 404 }),
  },
  {
    title: 'read an agreement of the own organization',
    method: 'GET',
    path: ({ fixtures }) => `/api/agreements/${fixtures.agreementId}`,
    policy: { table: 'agreements', action: 'read' },
    expect: statuses(200, { admin: 403, 'other-farm': 404, 'other-apiary': 404 }),
  },
  {
    title: 'confirm an agreement for the own side',
    method: 'POST',
    fresh: async ({ world }) => ({ id: (await agreementWith(world, 'awaiting-signatures')).agreementId }),
    path: ({ fresh }) => `/api/agreements/${fresh.id}/confirm`,
    policy: { table: 'agreements', action: 'confirm' },
    expect: statuses(403, { ...each([...farmManagers, ...apiaryManagers], 200), 'other-farm': 404, 'other-apiary': 404 }),
  },
  {
    title: 'propose an amendment to a confirmed agreement',
    method: 'POST',
    fresh: async ({ world }) => ({ id: (await agreementWith(world, 'in-force')).agreementId }),
    path: ({ fresh }) => `/api/agreements/${fresh.id}/amendments`,
    body: { changes: { noticeHours: 72 }, reason: 'More notice before sprays' },
    policy: { table: 'agreements', action: 'amend' },
    expect: statuses(403, { ...each([...farmManagers, ...apiaryManagers], 201), 'other-farm': 404, 'other-apiary': 404 }),
  },
  {
    title: 'read a placement of the own organization',
    method: 'GET',
    path: ({ fixtures }) => `/api/placements/${fixtures.placementId}`,
    policy: { table: 'placements', action: 'read' },
    expect: statuses(200, { admin: 403, 'other-farm': 404, 'other-apiary': 404 }),
  },
  {
    title: 'mark colonies delivered',
    method: 'POST',
    fresh: async ({ world }) => ({ id: (await agreementWith(world, 'in-force', 'scheduled')).placementId }),
    path: ({ fresh }) => `/api/placements/${fresh.id}/delivery`,
    body: { coloniesDelivered: 10 },
    policy: { table: 'placements', action: 'fieldStep' },
    expect: statuses(403, { ...each(['apiary:owner', 'apiary:manager', 'apiary:crew'], 201), 'other-apiary': 404 }),
  },
  {
    title: 'record a strength check (beekeeper side or the grower’s inspector)',
    method: 'POST',
    fresh: async ({ world }) => ({ id: (await agreementWith(world, 'in-force', 'delivered')).placementId }),
    path: ({ fresh }) => `/api/placements/${fresh.id}/strength-checks`,
    body: { framesOfBees: [8] },
    policy: { table: 'placements', action: 'strengthCheck' },
    expect: statuses(403, { ...each(['apiary:owner', 'apiary:manager', 'apiary:crew', ...farmManagers], 201), 'other-farm': 404, 'other-apiary': 404 }),
  },
  {
    title: 'dispute a delivered count',
    method: 'POST',
    path: ({ fixtures }) => `/api/placements/${fixtures.placementId}/dispute`,
    body: { step: 'delivery', countedColonies: 9, note: 'One pallet short' },
    policy: { table: 'placements', action: 'dispute' },
    expect: statuses(403, { ...each(farmManagers, 200), 'other-farm': 404 }),
  },
  {
    title: 'list the own apiary’s yards',
    method: 'GET',
    path: '/api/yards',
    policy: { table: 'yards', action: 'list' },
    expect: statuses(403, { ...each(apiaryMembers, 200), 'other-apiary': 200 }),
  },
  {
    title: 'add a yard',
    method: 'POST',
    path: '/api/yards',
    body: { name: 'Authz yard', location: { type: 'Point', coordinates: [-119.8, 44.95] } },
    policy: { table: 'yards', action: 'manage' },
    expect: statuses(403, { ...each(apiaryManagers, 201), 'other-apiary': 201 }),
  },
  {
    title: 'read the own calendar feed URL',
    method: 'GET',
    path: '/api/calendar',
    policy: { table: 'calendar', action: 'manage' },
    expect: statuses(200, { admin: 403 }),
  },
  {
    title: 'export the own requests as CSV',
    method: 'GET',
    path: '/api/exports/requests.csv',
    policy: { table: 'exports', action: 'export' },
    expect: statuses(403, { ...each([...farmManagers, ...apiaryManagers, 'other-farm', 'other-apiary'], 200) }),
  },
];

