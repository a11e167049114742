// Agreements: both sides confirm, then terms are fixed; amendments; the PDF; refusals.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildMarket, requestPayload } from '../support/builders/requests.js';
import { recheckRanSince } from '../support/recheck-jobs.js';

describe('agreements', () => {
  let t: TestApp;
  let m: Awaited<ReturnType<typeof buildMarket>>;
  let grower: ApiClient, keeper: ApiClient, keeper2: ApiClient, crew: ApiClient, farmViewer: ApiClient;

  beforeAll(async () => {
    t = await startTestApp();
    m = await buildMarket();
    grower = await signedInClient(t.app, m.people.grower.email);
    keeper = await signedInClient(t.app, m.people.keeper.email);
    keeper2 = await signedInClient(t.app, m.people.keeper2.email);
    crew = await signedInClient(t.app, m.people.crew.email);
    farmViewer = await signedInClient(t.app, m.people.farmViewer.email);
  });
  afterAll(async () => { await t?.stop(); });

  async function draftAgreement(colonies = 40) {
    const r = (await grower.post('/api/requests', requestPayload(m.block.id, {}, m)).expect(201)).body.request;
    await grower.post(`/api/requests/${r.id}/publish`).expect(200);
    const c = (await keeper.post(`/api/requests/${r.id}/commitments`, { colonies }).expect(201)).body.commitment;
    return { requestId: r.id as string, agreementId: c.agreementId as string };
  }

  async function agreementInForce(colonies = 40) {
    const d = await draftAgreement(colonies);
    await grower.post(`/api/agreements/${d.agreementId}/confirm`).expect(200);
    await keeper.post(`/api/agreements/${d.agreementId}/confirm`).expect(200);
    return d;
  }

  describe('POST /api/agreements/:id/confirm', () => {
    it('copies the terms with our clauses, records who confirmed when, and schedules placements over the drop sites', async () => {
      const { agreementId, requestId } = await draftAgreement(40);
      const draft = (await keeper.get(`/api/agreements/${agreementId}`)).body.agreement;
      expect(draft.state).toBe('awaiting-signatures');
      expect(draft.colonies).toBe(40);
      expect(draft.pricePerColonyCents).toBe(7000);
      expect(draft.noticeHours).toBe(48);
      expect(draft.clauses.map((c: { key: string }) => c.key)).toEqual(expect.arrayContaining(['colonies', 'inspection', 'fee', 'pesticides', 'water', 'access', 'removal', 'extra-moves', 'liability', 'changes']));
      expect(draft.clauses.find((c: { key: string }) => c.key === 'pesticides').text).toMatch(/at least 48 hours before/);
      expect(draft.clauses.find((c: { key: string }) => c.key === 'fee').text).toMatch(/70\.00 USD per colony/);

      const first = await grower.post(`/api/agreements/${agreementId}/confirm`);
      expect(first.body.agreement.farmConfirmation.byName).toBe('Gale Orrin');
      expect(first.body.agreement.state).toBe('awaiting-signatures');
      expect((await grower.post(`/api/agreements/${agreementId}/confirm`)).status).toBe(409);

      const confirmedAt = new Date();
      const second = await keeper.post(`/api/agreements/${agreementId}/confirm`);
      expect(second.body.agreement.state).toBe('in-force');
      expect(second.body.agreement.apiaryConfirmation.byName).toBe('Bram Tully');
      expect(Date.parse(second.body.agreement.apiaryConfirmation.at)).toBeGreaterThan(0);

      const placements = (await crew.get(`/api/placements?agreementId=${agreementId}`)).body.placements;
      // 40 colonies: 36 fill the North lane (planned 36), 4 go to the South gate.
      expect(placements.map((p: { dropSite: { name: string }; coloniesPlanned: number }) => [p.dropSite.name, p.coloniesPlanned])).toEqual([['North lane', 36], ['South gate', 4]]);
      expect(placements.every((p: { state: string; onSite: { from: string } }) => p.state === 'scheduled' && p.onSite.from === draft.expectedOnSite.from)).toBe(true);
      // The agreement in force is re-checked against planned sprays.
      await expect.poll(() => recheckRanSince(t, `agreement:${agreementId}`, confirmedAt), { timeout: 10_000 }).toBe(true);

      // The gate code reaches the beekeeper only now.
      expect((await keeper.get(`/api/requests/${requestId}`)).body.request.dropSites[0].gateCode).toBe('4471');
      expect((await keeper.get(`/api/requests/${requestId}`)).body.request.dropSites[0].gateCodeHidden).toBe(false);
      await expect.poll(() => t.sink.messages.some((msg) => msg.to.includes(m.people.grower.email) && msg.subject === 'Agreement confirmed by both sides'), { timeout: 10_000 }).toBe(true);
    });

    it('refuses crew and viewers (403), another apiary (404) and a cancelled agreement (409)', async () => {
      const { agreementId } = await draftAgreement(10);
      expect((await crew.post(`/api/agreements/${agreementId}/confirm`)).status).toBe(403);
      expect((await farmViewer.post(`/api/agreements/${agreementId}/confirm`)).status).toBe(403);
      expect((await keeper2.post(`/api/agreements/${agreementId}/confirm`)).status).toBe(404);
      expect((await keeper2.get(`/api/agreements/${agreementId}`)).status).toBe(404);
      const commitment = (await keeper.get('/api/commitments')).body.commitments.find((c: { agreementId: string }) => c.agreementId === agreementId);
      await keeper.post(`/api/commitments/${commitment.id}/withdraw`).expect(200);
      const res = await grower.post(`/api/agreements/${agreementId}/confirm`);
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('wrong_state');
    });
  });

  describe('amendments', () => {
    it('changes a confirmed agreement only when the other side confirms, raising its version', async () => {
      const { agreementId } = await agreementInForce(20);
      const before = (await grower.get(`/api/agreements/${agreementId}`)).body.agreement;
      const proposed = await keeper.post(`/api/agreements/${agreementId}/amendments`, {
        changes: { pricePerColonyCents: 7600, expectedOnSite: { from: '2027-04-11T07:00:00.000Z', to: '2027-05-03T07:00:00.000Z' } },
        reason: 'Two more days after petal fall at a higher fee',
      });
      expect(proposed.status).toBe(201);
      const amendment = proposed.body.agreement.amendments[0];
      expect(amendment.state).toBe('proposed');
      expect(proposed.body.agreement.pricePerColonyCents).toBe(7000); // not yet changed

      expect((await keeper.post(`/api/agreements/${agreementId}/amendments`, { changes: { noticeHours: 24 }, reason: 'Another' })).status).toBe(409);
      expect((await keeper.post(`/api/agreements/${agreementId}/amendments/${amendment.id}/confirm`)).status).toBe(403);
      expect((await crew.post(`/api/agreements/${agreementId}/amendments/${amendment.id}/confirm`)).status).toBe(403);

      const amendedAt = new Date();
      const confirmed = await grower.post(`/api/agreements/${agreementId}/amendments/${amendment.id}/confirm`);
      expect(confirmed.status).toBe(200);
      const after = confirmed.body.agreement;
      expect(after.version).toBe(before.version + 1);
      expect(after.pricePerColonyCents).toBe(7600);
      expect(after.expectedOnSite).toEqual({ from: '2027-04-11T07:00:00.000Z', to: '2027-05-03T07:00:00.000Z' });
      expect(after.clauses.find((c: { key: string }) => c.key === 'fee').text).toMatch(/76\.00 USD/);
      expect(after.amendments[0]).toMatchObject({ state: 'accepted', versionAfter: before.version + 1, decidedByName: 'Gale Orrin', previous: { pricePerColonyCents: 7000 } });
      const placements = (await grower.get(`/api/placements?agreementId=${agreementId}`)).body.placements;
      expect(placements.every((p: { onSite: { from: string; to: string } }) => p.onSite.from === '2027-04-11T07:00:00.000Z' && p.onSite.to === '2027-05-03T07:00:00.000Z')).toBe(true);
      await expect.poll(() => recheckRanSince(t, `agreement:${agreementId}`, amendedAt), { timeout: 10_000 }).toBe(true);
      expect((await grower.post(`/api/agreements/${agreementId}/amendments/${amendment.id}/reject`)).status).toBe(409);
    });

    it('lets the other side reject and the proposing side withdraw; refuses bad changes and unconfirmed agreements', async () => {
      const { agreementId } = await agreementInForce(10);
      const a1 = (await grower.post(`/api/agreements/${agreementId}/amendments`, { changes: { noticeHours: 72 }, reason: 'More notice' })).body.agreement.amendments[0];
      const rejected = await keeper.post(`/api/agreements/${agreementId}/amendments/${a1.id}/reject`);
      expect(rejected.body.agreement.amendments[0].state).toBe('rejected');
      expect(rejected.body.agreement.noticeHours).toBe(48);
      const a2 = (await grower.post(`/api/agreements/${agreementId}/amendments`, { changes: { removalNoticeHours: 24 }, reason: 'Faster pickup' })).body.agreement.amendments[1];
      expect((await keeper.post(`/api/agreements/${agreementId}/amendments/${a2.id}/withdraw`)).status).toBe(403);
      expect((await grower.post(`/api/agreements/${agreementId}/amendments/${a2.id}/withdraw`)).body.agreement.amendments[1].state).toBe('withdrawn');

      const empty = await grower.post(`/api/agreements/${agreementId}/amendments`, { changes: {}, reason: 'Nothing' });
      expect(empty.status).toBe(400);
      expect(empty.body.error.fields).toHaveProperty('changes');
      const colonies = await grower.post(`/api/agreements/${agreementId}/amendments`, { changes: { colonies: 5 }, reason: 'Not amendable' });
      expect(colonies.status).toBe(400);
      const backwards = await grower.post(`/api/agreements/${agreementId}/amendments`, { changes: { expectedOnSite: { from: '2027-05-01T00:00:00Z', to: '2027-04-01T00:00:00Z' } }, reason: 'Backwards' });
      expect(backwards.status).toBe(400);
      expect(backwards.body.error.fields).toHaveProperty(['changes.expectedOnSite.to']);

      const { agreementId: unsigned } = await draftAgreement(5);
      expect((await grower.post(`/api/agreements/${unsigned}/amendments`, { changes: { noticeHours: 24 }, reason: 'Too early' })).status).toBe(409);
    });
  });

  describe('GET /api/agreements/:id/pdf', () => {
    it('downloads a PDF set in Work Sans with the parties and clauses', async () => {
      const { agreementId } = await agreementInForce(8);
      const res = await farmViewer.get(`/api/agreements/${agreementId}/pdf`).buffer(true).parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toBe('application/pdf');
      const pdf = res.body as Buffer;
      expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
      expect(pdf.toString('latin1')).toMatch(/WorkSans/); // the embedded font's name
      expect(pdf.length).toBeGreaterThan(5000);
      expect((await keeper2.get(`/api/agreements/${agreementId}/pdf`)).status).toBe(404);
    });
  });

  it('lists the agreements of each party only', async () => {
    const mine = (await keeper.get('/api/agreements')).body.agreements;
    expect(mine.length).toBeGreaterThan(0);
    expect(mine.every((a: { apiaryId: string }) => a.apiaryId === m.apiary.id)).toBe(true);
    expect((await keeper2.get('/api/agreements')).body.agreements.every((a: { apiaryId: string }) => a.apiaryId === m.apiary2.id)).toBe(true);
  });
});
