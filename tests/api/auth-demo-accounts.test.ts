// The demo accounts the README lists: each signs in with pollen-demo-2026 and has the
// organization kind and role the README gives it.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { apiClient } from '../support/api-client.js';
import { seedAccounts } from '../../seed/parts/accounts.seed.js';
import type { SeedWorld } from '../../seed/seed-world.js';

const demoAccounts: Array<[email: string, kind: 'farm' | 'apiary' | null, role: string, organization: string | null]> = [
  ['grower@orchard.test', 'farm', 'owner', 'Larkspur Bench Orchards'],
  ['applicator@orchard.test', 'farm', 'applicator', 'Larkspur Bench Orchards'],
  ['grower2@ridge.test', 'farm', 'owner', 'Cinder Ridge Fruit Co.'],
  ['keeper@apiary.test', 'apiary', 'owner', 'Fernhollow Apiaries'],
  ['crew@apiary.test', 'apiary', 'crew', 'Fernhollow Apiaries'],
  ['keeper2@hives.test', 'apiary', 'owner', 'Brightcomb Hive Works'],
  ['admin@pollenpact.test', null, 'admin', null],
];

describe('demo accounts', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
    await seedAccounts({ today: new Date(), extra: {} } as SeedWorld);
  });
  afterAll(async () => { await t?.stop(); });

  it.each(demoAccounts)('%s signs in with the demo password, with the kind and role the README gives', async (email, kind, role, organization) => {
    const client = await apiClient(t.app);
    const res = await client.post('/api/auth/login', { email, password: 'pollen-demo-2026' });
    expect(res.status).toBe(200);
    expect(res.body.user.role).toBe(role);
    expect(res.body.user.organization?.kind ?? null).toBe(kind);
    expect(res.body.user.organization?.name ?? null).toBe(organization);
  });
});
