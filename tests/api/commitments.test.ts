// Commitments: beekeepers commit all or part of a request; price offers; withdrawals; refusals.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildMarket, requestPayload } from '../support/builders/requests.js';

describe('commitments', () => {
  let t: TestApp;
  let m: Awaited<ReturnType<typeof buildMarket>>;
  let grower: ApiClient, keeper: ApiClient, keeper2: ApiClient, crew: ApiClient, otherGrower: ApiClient;

  beforeAll(async () => {
    t = await startTestApp();
    m = await buildMarket();
    grower = await signedInClient(t.app, m.people.grower.email);
    keeper = await signedInClient(t.app, m.people.keeper.email);
    keeper2 = await signedInClient(t.app, m.people.keeper2.email);
    crew = await signedInClient(t.app, m.people.crew.email);
    otherGrower = await signedInClient(t.app, m.people.otherGrower.email);
  });
  afterAll(async () => { await t?.stop(); });

  async function openRequest(overrides = {}) {
    const r = (await grower.post('/api/requests', requestPayload(m.block.id, overrides, m)).expect(201)).body.request;
    await grower.post(`/api/requests/${r.id}/publish`).expect(200);
    return r;
  }

  describe('POST /api/requests/:id/commitments', () => {
    it('splits one request between two beekeepers and marks it fully committed', async () => {
      const r = await openRequest();
      const first = await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 40 });
      expect(first.status).toBe(201);
      expect(first.body.commitment.state).toBe('accepted'); // at the asked price: no answer needed
      expect(first.body.commitment.agreementId).toEqual(expect.any(String));
      expect(first.body.coloniesOpen).toBe(20);

      const tooMany = await keeper2.post(`/api/requests/${r.id}/commitments`, { colonies: 25 });
      expect(tooMany.status).toBe(409);
      expect(tooMany.body.error.code).toBe('over_committed');
      expect(tooMany.body.error.message).toMatch(/Only 20 colonies are still open/);
      expect(tooMany.body.error.fields.colonies).toBe('at most 20 still open');

      const rest = await keeper2.post(`/api/requests/${r.id}/commitments`, { colonies: 20 });
      expect(rest.status).toBe(201);
      expect(rest.body.coloniesOpen).toBe(0);
      const detail = (await grower.get(`/api/requests/${r.id}`)).body.request;
      expect(detail.state).toBe('filled');
      expect(detail.coloniesCommitted).toBe(60);
      expect(detail.commitments.map((c: { colonies: number }) => c.colonies)).toEqual([40, 20]);
      expect(detail.events.map((e: { action: string }) => e.action)).toEqual(expect.arrayContaining(['commitment-offered', 'agreement-drafted', 'fully-committed']));

      const none = await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 1 });
      expect(none.status).toBe(409);
      expect(none.body.error.message).toMatch(/No colonies are still open/);
      // A beekeeper sees only its own commitment.
      expect((await keeper2.get(`/api/requests/${r.id}`)).body.request.commitments).toHaveLength(1);
      await expect.poll(() => t.sink.messages.some((msg) => msg.to.includes(m.people.grower.email) && /committed 20 colonies/.test(msg.subject)), { timeout: 10_000 }).toBe(true);
    });

    it('refuses a second open commitment from the same apiary (409), bad input (400) and the wrong roles', async () => {
      const r = await openRequest();
      await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 5 }).expect(201);
      const again = await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 5 });
      expect(again.status).toBe(409);
      expect(again.body.error.code).toBe('conflict');
      const bad = await keeper2.post(`/api/requests/${r.id}/commitments`, { colonies: -3 });
      expect(bad.status).toBe(400);
      expect(bad.body.error.fields).toHaveProperty('colonies');
      expect((await crew.post(`/api/requests/${r.id}/commitments`, { colonies: 5 })).status).toBe(403);
      expect((await grower.post(`/api/requests/${r.id}/commitments`, { colonies: 5 })).status).toBe(403);
      expect((await keeper.post('/api/requests/00000000-0000-4000-8000-000000000000/commitments', { colonies: 5 })).status).toBe(404);
    });
  });

  describe('price offers', () => {
    it('lets the grower accept a different price, which the agreement then carries', async () => {
      const r = await openRequest();
      const offer = (await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 30, proposedPriceCents: 8200, note: 'Strong singles' })).body.commitment;
      expect(offer.state).toBe('offered');
      expect(offer.agreementId).toBeNull();
      expect((await keeper.post(`/api/commitments/${offer.id}/accept`)).status).toBe(403); // the beekeeper cannot accept its own offer
      expect((await otherGrower.post(`/api/commitments/${offer.id}/accept`)).status).toBe(404);
      const accepted = await grower.post(`/api/commitments/${offer.id}/accept`);
      expect(accepted.status).toBe(200);
      expect(accepted.body.commitment.state).toBe('accepted');
      const agreement = (await keeper.get(`/api/agreements/${accepted.body.commitment.agreementId}`)).body.agreement;
      expect(agreement.pricePerColonyCents).toBe(8200);
      expect(agreement.state).toBe('awaiting-signatures');
      expect((await grower.post(`/api/commitments/${offer.id}/accept`)).status).toBe(409);
    });

    it('frees the colonies when the grower declines', async () => {
      const r = await openRequest();
      const offer = (await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 60, proposedPriceCents: 9900 })).body.commitment;
      expect((await grower.get(`/api/requests/${r.id}`)).body.request.state).toBe('filled');
      const declined = await grower.post(`/api/commitments/${offer.id}/decline`);
      expect(declined.body.commitment.state).toBe('declined');
      expect(declined.body.coloniesOpen).toBe(60);
      expect((await grower.get(`/api/requests/${r.id}`)).body.request.state).toBe('listed');
    });
  });

  describe('POST /api/commitments/:id/withdraw', () => {
    it('withdraws before the agreement is confirmed, cancelling it and reopening the colonies', async () => {
      const r = await openRequest();
      const c = (await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 60 })).body.commitment;
      expect((await keeper2.post(`/api/commitments/${c.id}/withdraw`)).status).toBe(404);
      const res = await keeper.post(`/api/commitments/${c.id}/withdraw`);
      expect(res.status).toBe(200);
      expect(res.body.commitment.state).toBe('withdrawn');
      expect(res.body.coloniesOpen).toBe(60);
      expect((await keeper.get(`/api/agreements/${c.agreementId}`)).body.agreement.state).toBe('cancelled');
      expect((await keeper.post(`/api/commitments/${c.id}/withdraw`)).status).toBe(409);
    });

    it('refuses once both sides confirmed the agreement', async () => {
      const r = await openRequest();
      const c = (await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 10 })).body.commitment;
      await grower.post(`/api/agreements/${c.agreementId}/confirm`).expect(200);
      await keeper.post(`/api/agreements/${c.agreementId}/confirm`).expect(200);
      const res = await keeper.post(`/api/commitments/${c.id}/withdraw`);
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('wrong_state');
    });
  });

  it('lists an apiary its own commitments', async () => {
    const list = await keeper.get('/api/commitments');
    expect(list.status).toBe(200);
    expect(list.body.commitments.length).toBeGreaterThan(0);
    expect(list.body.commitments.every((c: { apiaryId: string }) => c.apiaryId === m.apiary.id)).toBe(true);
    expect((await grower.get('/api/commitments')).status).toBe(403);
  });
});
