// Fifty beekeepers commit to one request at the same moment: the committed total never
// exceeds the request, and every refused beekeeper is told how many colonies are still open.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildMarket, requestPayload } from '../support/builders/requests.js';

describe('50 concurrent commitments', () => {
  let t: TestApp;
  let requestId: string;
  const beekeepers: ApiClient[] = [];
  const sizes = Array.from({ length: 50 }, (_, i) => (i % 4) + 2); // 2, 3, 4, 5 colonies: 175 offered in all

  beforeAll(async () => {
    t = await startTestApp({ config: { loginRateLimit: { perAccount: 1000, perAddress: 1000 } } });
    const m = await buildMarket();
    const grower = await signedInClient(t.app, m.people.grower.email);
    const r = (await grower.post('/api/requests', requestPayload(m.block.id, { blocks: [{ blockId: m.block.id, colonies: 60 }] }, m)).expect(201)).body.request;
    await grower.post(`/api/requests/${r.id}/publish`).expect(200);
    requestId = r.id;
    const emails: string[] = [];
    for (let i = 0; i < 50; i++) {
      const apiary = await buildOrganization({ kind: 'apiary', name: `Racing Apiary ${i}` });
      emails.push((await buildUser({ organization: apiary, role: 'owner', email: `racer-${i}-${Date.now()}@example.test` })).email);
    }
    beekeepers.push(...(await Promise.all(emails.map((email) => signedInClient(t.app, email)))));
  }, 120_000);
  afterAll(async () => { await t?.stop(); });

  it('never commits more than requested and answers each refusal with 409 and the colonies still open', async () => {
    const answers = await Promise.all(beekeepers.map((client, i) => client.post(`/api/requests/${requestId}/commitments`, { colonies: sizes[i] })));
    const accepted = answers.map((res, i) => ({ res, size: sizes[i] })).filter(({ res }) => res.status === 201);
    const refused = answers.map((res, i) => ({ res, size: sizes[i] })).filter(({ res }) => res.status !== 201);
    expect(accepted.length + refused.length).toBe(50);

    const [row] = await t.context.sequelize.query<{ total: string }>(
      "SELECT coalesce(sum(colonies), 0) AS total FROM commitments WHERE request_id = :requestId AND state IN ('offered', 'accepted')",
      { replacements: { requestId }, type: QueryTypes.SELECT },
    );
    const total = Number(row.total);
    expect(total).toBeLessThanOrEqual(60);
    expect(total).toBe(accepted.reduce((sum, a) => sum + a.size, 0));
    // 175 colonies were offered for 60: some must have been refused.
    expect(refused.length).toBeGreaterThan(0);
    for (const { res, size } of refused) {
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('over_committed');
      const open = /No colonies/.test(res.body.error.message) ? 0 : Number(/Only (\d+) colon/.exec(res.body.error.message)?.[1]);
      expect(Number.isInteger(open)).toBe(true);
      expect(open).toBeLessThan(size); // refused only because fewer were open than offered
      expect(res.body.error.fields.colonies).toBe(`at most ${open} still open`);
    }
    // What is still open now is what the last refusals could not have had.
    expect(60 - total).toBeLessThan(Math.max(...refused.map((r) => r.size)));
    // Every accepted commitment at the asked price has its agreement, one each.
    const [agreements] = await t.context.sequelize.query<{ n: string }>('SELECT count(*) AS n FROM agreements WHERE request_id = :requestId', { replacements: { requestId }, type: QueryTypes.SELECT });
    expect(Number(agreements.n)).toBe(accepted.length);
  });
});
