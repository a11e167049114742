// Every change that can create or clear a spray conflict, made through its own route, queues
// the durable re-check in its transaction (the job runs after the commit). Spray plan
// changes, bloom windows, a block redrawn and agreements ending before they are signed are covered here;
// drop-off, pickup, signing and amending in placements.test.ts and agreements.test.ts.
// An agreement waiting for signatures counts in the check as colonies expected on site, so
// when it ends (the beekeeper withdraws, or the grower withdraws the request) its alert is
// resolved by the re-check.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildMarket, requestPayload } from '../support/builders/requests.js';
import { sprayInput } from '../support/builders/sprays.js';
import { buildBlock, squareOutline } from '../support/builders/season.js';
import { recheckRanSince } from '../support/recheck-jobs.js';

describe('changes that queue a spray conflict re-check', () => {
  let t: TestApp;
  let m: Awaited<ReturnType<typeof buildMarket>>;
  let grower: ApiClient;
  let keeper: ApiClient;

  beforeAll(async () => {
    t = await startTestApp();
    m = await buildMarket();
    grower = await signedInClient(t.app, m.people.grower.email);
    keeper = await signedInClient(t.app, m.people.keeper.email);
  });
  afterAll(async () => { await t?.stop(); });

  /** A listed request on the block and an agreement waiting for signatures: a night midway through its expected stay. */
  async function unsignedAgreement() {
    const request = (await grower.post('/api/requests', requestPayload(m.block.id, {}, m)).expect(201)).body.request;
    await grower.post(`/api/requests/${request.id}/publish`).expect(200);
    const offer = (await keeper.post(`/api/requests/${request.id}/commitments`, { colonies: 20 }).expect(201)).body.commitment;
    const agreement = (await keeper.get(`/api/agreements/${offer.agreementId}`).expect(200)).body.agreement;
    expect(agreement.state).toBe('awaiting-signatures');
    const from = new Date(agreement.expectedOnSite.from).getTime();
    const to = new Date(agreement.expectedOnSite.to).getTime();
    return { requestId: request.id as string, commitmentId: offer.id as string, agreementId: agreement.id as string, midway: new Date(from + Math.floor((to - from) / 2)) };
  }

  /** A spray (a product without label data) on a block, with the apiary businesses its check finds. */
  async function sprayOn(blockId: string, startsAt: Date, productName: string) {
    const saved = (await grower.post('/api/sprays', sprayInput({ blockIds: [blockId], startsAt, productName })).expect(201)).body;
    return { sprayId: saved.spray.id as string, apiaries: saved.check.conflicts.map((c: { apiaryId: string | null }) => c.apiaryId).filter(Boolean) as string[] };
  }

  /** The agreement's colonies are expected on the sprayed block: an alert for the apiary. */
  async function expectedColoniesUnderSpray(productName: string) {
    const agreement = await unsignedAgreement();
    const spray = await sprayOn(m.block.id, agreement.midway, productName);
    expect(spray.apiaries).toEqual([m.apiary.id]);
    return { ...agreement, sprayId: spray.sprayId };
  }

  /** The state of the spray's alert for the apiary business (the farm's own bloom alert stays). */
  const apiaryAlert = async (sprayId: string) => (await t.context.models.Alert.findOne({ where: { sprayPlanId: sprayId, apiaryId: m.apiary.id } }))?.state;

  /** No re-check with this key waits or runs: a job completed after this moment was asked for by what follows. */
  const settled = async (key: string) => {
    await expect.poll(async () => (await t.context.sequelize.query<{ n: number }>(
      `SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'conflict-recheck' AND singleton_key = $key AND state IN ('created', 'retry', 'active')`,
      { bind: { key }, type: QueryTypes.SELECT },
    ))[0].n, { timeout: 10_000 }).toBe(0);
    return new Date();
  };

  it('resolves the alert when the beekeeper withdraws before the agreement is signed', async () => {
    const { commitmentId, agreementId, sprayId } = await expectedColoniesUnderSpray('Tansyfield 4EC');
    expect(await apiaryAlert(sprayId)).toBe('raised');
    const at = await settled(`agreement:${agreementId}`);
    await keeper.post(`/api/commitments/${commitmentId}/withdraw`).expect(200);
    await expect.poll(() => recheckRanSince(t, `agreement:${agreementId}`, at), { timeout: 10_000 }).toBe(true);
    await expect.poll(() => apiaryAlert(sprayId), { timeout: 10_000 }).toBe('resolved');
  });

  it('resolves the alert when the grower withdraws the request before the agreement is signed', async () => {
    const { requestId, agreementId, sprayId } = await expectedColoniesUnderSpray('Tansyfield 5EC');
    expect(await apiaryAlert(sprayId)).toBe('raised');
    const at = await settled(`agreement:${agreementId}`);
    await grower.post(`/api/requests/${requestId}/withdraw`).expect(200);
    await expect.poll(() => recheckRanSince(t, `agreement:${agreementId}`, at), { timeout: 10_000 }).toBe(true);
    await expect.poll(() => apiaryAlert(sprayId), { timeout: 10_000 }).toBe('resolved');
  });

  it('raises the alert when a block is redrawn to reach colonies its spray did not', async () => {
    const { midway } = await unsignedAgreement();
    const far = await buildBlock({ farm: m.farm, name: 'Far Bartletts', lon: m.lon + 0.3, lat: m.lat });
    const { sprayId, apiaries } = await sprayOn(far.id, midway, 'Tansyfield 8EC');
    expect(apiaries).toEqual([]);
    const at = await settled(`block:${far.id}`);
    await grower.patch(`/api/blocks/${far.id}`, { outline: squareOutline(m.lon + 0.004, m.lat, 20) }).expect(200);
    await expect.poll(() => recheckRanSince(t, `block:${far.id}`, at), { timeout: 10_000 }).toBe(true);
    await expect.poll(() => apiaryAlert(sprayId), { timeout: 10_000 }).toBe('raised');
  });

  it('re-checks a spray plan after it is changed, applied and cancelled, and a block after its bloom window is published or revised', async () => {
    const night = new Date('2027-04-15T08:00:00Z');
    const planned = (await grower.post('/api/sprays', sprayInput({ blockIds: [m.block.id], startsAt: night, productName: 'Tansyfield 6EC' })).expect(201)).body.spray;
    const other = (await grower.post('/api/sprays', sprayInput({ blockIds: [m.block.id], startsAt: night, productName: 'Tansyfield 7EC' })).expect(201)).body.spray;
    const key = (id: string) => `spray:${id}`;
    let at = await settled(key(planned.id));
    await grower.patch(`/api/sprays/${planned.id}`, { notes: 'Applicator to confirm the nozzle set' }).expect(200);
    await expect.poll(() => recheckRanSince(t, key(planned.id), at), { timeout: 10_000 }).toBe(true);
    at = await settled(key(planned.id));
    await grower.post(`/api/sprays/${planned.id}/apply`, { appliedAt: new Date(Date.now() - 60_000).toISOString() }).expect(200);
    await expect.poll(() => recheckRanSince(t, key(planned.id), at), { timeout: 10_000 }).toBe(true);
    at = await settled(key(other.id));
    await grower.post(`/api/sprays/${other.id}/cancel`).expect(200);
    await expect.poll(() => recheckRanSince(t, key(other.id), at), { timeout: 10_000 }).toBe(true);

    for (const window of [{ bloomStart: '2027-04-08', petalFall: '2027-04-28' }, { bloomStart: '2027-04-12', petalFall: '2027-05-02' }]) {
      at = await settled(`block:${m.block.id}`);
      await grower.post(`/api/blocks/${m.block.id}/bloom-windows`, window).expect(201);
      await expect.poll(() => recheckRanSince(t, `block:${m.block.id}`, at), { timeout: 10_000 }).toBe(true);
    }
  });
});
