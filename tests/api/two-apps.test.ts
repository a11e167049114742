// Two apps in one process, each on its own database: each app's models stay bound to its
// own Sequelize instance, so what one app writes (through HTTP or its models) lands in its
// own database and neither sees the other's rows.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import pg from 'pg';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { apiClient } from '../support/api-client.js';

async function organizationNamesIn(databaseUrl: string): Promise<string[]> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const { rows } = await client.query<{ name: string }>('SELECT name FROM organizations ORDER BY name');
    return rows.map((r) => r.name);
  } finally {
    await client.end();
  }
}

async function signUp(t: TestApp, email: string, organization: string) {
  const client = await apiClient(t.app);
  const res = await client.post('/api/auth/signup', {
    name: 'Tamsin Oakridge', email, password: 'ladder-orchard-evening', organization: { name: organization, kind: 'farm', timeZone: 'America/Los_Angeles' },
  });
  expect(res.status).toBe(201);
  return client;
}

describe('two apps in one process', () => {
  let first: TestApp;
  let second: TestApp;
  beforeAll(async () => {
    first = await startTestApp();
    second = await startTestApp(); // started last: a process-wide model binding would point here
  });
  afterAll(async () => {
    await first?.stop();
    await second?.stop();
  });

  it('keeps each app\'s models on its own Sequelize instance', () => {
    expect(first.context.models.Organization.sequelize).toBe(first.context.sequelize);
    expect(second.context.models.Organization.sequelize).toBe(second.context.sequelize);
    expect(first.context.models.Block).not.toBe(second.context.models.Block);
  });

  it('writes a sign-up through each app into that app\'s database only', async () => {
    const firstClient = await signUp(first, 'owner@first-valley.test', 'First Valley Orchard');
    const secondClient = await signUp(second, 'owner@second-valley.test', 'Second Valley Orchard');

    expect(await organizationNamesIn(first.databaseUrl)).toContain('First Valley Orchard');
    expect(await organizationNamesIn(first.databaseUrl)).not.toContain('Second Valley Orchard');
    expect(await organizationNamesIn(second.databaseUrl)).toContain('Second Valley Orchard');
    expect(await organizationNamesIn(second.databaseUrl)).not.toContain('First Valley Orchard');

    // Each session's user is read back through its own app's models.
    expect((await firstClient.get('/api/auth/me').expect(200)).body.user.organization.name).toBe('First Valley Orchard');
    expect((await secondClient.get('/api/auth/me').expect(200)).body.user.organization.name).toBe('Second Valley Orchard');
    // The other app never heard of that account.
    const stranger = await apiClient(second.app);
    await stranger.post('/api/auth/login', { email: 'owner@first-valley.test', password: 'ladder-orchard-evening' }).expect(401);
  });

  it('creates and reads rows through each app\'s registry on its own database', async () => {
    await first.context.models.Organization.create({ kind: 'apiary', name: 'Registry Apiary One', billingEmail: null, coloniesOwned: 120 });
    await second.context.models.Organization.create({ kind: 'apiary', name: 'Registry Apiary Two', billingEmail: null, coloniesOwned: 80 });

    const firstNames = (await first.context.models.Organization.findAll()).map((o) => o.name);
    const secondNames = (await second.context.models.Organization.findAll()).map((o) => o.name);
    expect(firstNames).toContain('Registry Apiary One');
    expect(firstNames).not.toContain('Registry Apiary Two');
    expect(secondNames).toContain('Registry Apiary Two');
    expect(secondNames).not.toContain('Registry Apiary One');
    expect(await organizationNamesIn(first.databaseUrl)).toContain('Registry Apiary One');
  });
});
