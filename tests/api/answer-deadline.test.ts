// Answer deadlines are calendar days at the farm: a request due "by 15 May" on a Pacific farm
// takes commitments until midnight there, not until midnight UTC (about 7 hours earlier).
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildBlock, buildRequest } from '../support/builders/season.js';

describe('answer deadline (respond_by) in the farm\'s time zone', () => {
  let t: TestApp;
  let clock = new Date('2027-05-16T01:00:00Z');
  let keeper: ApiClient;
  let farm: { id: string };

  beforeAll(async () => {
    t = await startTestApp({ now: () => clock });
    // The farm keeps Pacific time (America/Los_Angeles, UTC-7 in May: IANA time zone database).
    farm = await buildOrganization({ kind: 'farm', name: 'Tidewell Orchards', timeZone: 'America/Los_Angeles' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Copperleaf Bees' });
    await buildUser({ organization: apiary, role: 'owner', email: 'owner@copperleaf.test' });
    keeper = await signedInClient(t.app, 'owner@copperleaf.test');
  });
  afterAll(async () => { await t?.stop(); });

  const requestDueOn = async (respondBy: string) => {
    const block = await buildBlock({ farm, acres: 10 });
    return buildRequest({ farm, blocks: [{ block, colonies: 10 }], respondBy, onSite: { from: new Date('2027-06-01T07:00:00Z'), to: new Date('2027-06-15T07:00:00Z') } });
  };

  it('takes a commitment at 18:00 on the deadline day, local, after UTC midnight has passed', async () => {
    clock = new Date('2027-05-16T01:00:00Z'); // 18:00 on 15 May in Los Angeles
    const r = await requestDueOn('2027-05-15');
    await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 5 }).expect(201);
  });

  it('refuses one once the deadline day is over at the farm', async () => {
    clock = new Date('2027-05-16T07:30:00Z'); // 00:30 on 16 May in Los Angeles
    const r = await requestDueOn('2027-05-15');
    const late = await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 5 });
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/deadline/);
  });
});
