// A hundred commitment offers on one request arrive at the same moment, from a hundred
// apiary businesses, for far more colonies than are open (at the asked price and at other
// prices): the committed total never exceeds the colonies asked, no answer is a server
// error, and every refusal is a 409 saying how many colonies are still open.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildMarket, requestPayload } from '../support/builders/requests.js';

const asked = 80;
const offers = 100;
// 3 to 9 colonies each, 600 in all; every fifth at a price of its own (an offer waiting for the grower).
const sizes = Array.from({ length: offers }, (_, i) => 3 + (i % 7));
const priceOf = (i: number) => (i % 5 === 4 ? 8200 : undefined);

describe('100 simultaneous commitment offers on one request', () => {
  let t: TestApp;
  let requestId: string;
  const beekeepers: ApiClient[] = [];

  beforeAll(async () => {
    t = await startTestApp({ config: { loginRateLimit: { perAccount: 10_000, perAddress: 10_000 } } });
    const m = await buildMarket();
    const grower = await signedInClient(t.app, m.people.grower.email);
    const created = (await grower.post('/api/requests', requestPayload(m.block.id, { blocks: [{ blockId: m.block.id, colonies: asked }] }, m)).expect(201)).body.request;
    await grower.post(`/api/requests/${created.id}/publish`).expect(200);
    requestId = created.id;
    const emails: string[] = [];
    for (let i = 0; i < offers; i++) {
      const apiary = await buildOrganization({ kind: 'apiary', name: `Burst Apiary ${i}` });
      emails.push((await buildUser({ organization: apiary, role: i % 2 ? 'manager' : 'owner', email: `burst-${i}-${Date.now()}@example.test` })).email);
    }
    for (let i = 0; i < emails.length; i += 20) beekeepers.push(...(await Promise.all(emails.slice(i, i + 20).map((email) => signedInClient(t.app, email)))));
  }, 180_000);
  afterAll(async () => { await t?.stop(); });

  it('never commits more than asked and refuses the rest with 409 and the colonies still open', async () => {
    const answers = await Promise.all(beekeepers.map((client, i) => client.post(`/api/requests/${requestId}/commitments`, { colonies: sizes[i], proposedPriceCents: priceOf(i) })));
    const statuses = answers.map((res) => res.status);
    expect(statuses.filter((s) => s >= 500)).toEqual([]);
    expect(new Set(statuses)).toEqual(new Set(statuses.filter((s) => s === 201 || s === 409)));

    const accepted = answers.map((res, i) => ({ res, size: sizes[i] })).filter(({ res }) => res.status === 201);
    const refused = answers.map((res, i) => ({ res, size: sizes[i] })).filter(({ res }) => res.status === 409);
    const [row] = await t.context.sequelize.query<{ total: string }>(
      "SELECT coalesce(sum(colonies), 0) AS total FROM commitments WHERE request_id = :requestId AND state IN ('offered', 'accepted')",
      { replacements: { requestId }, type: QueryTypes.SELECT },
    );
    const total = Number(row.total);
    expect(total).toBeLessThanOrEqual(asked);
    expect(total).toBe(accepted.reduce((sum, a) => sum + a.size, 0));
    expect(refused.length).toBeGreaterThan(0); // 600 offered for 80
    const stillOpen = asked - total;
    for (const { res, size } of refused) {
      expect(res.body.error.code).toBe('over_committed');
      const open = /No colonies/.test(res.body.error.message) ? 0 : Number(/Only (\d+) colon/.exec(res.body.error.message)?.[1]);
      expect(Number.isInteger(open), res.body.error.message).toBe(true);
      expect(open).toBeLessThan(size);
      // Colonies only get fewer: no refusal names fewer open colonies than are open at the end.
      expect(open).toBeGreaterThanOrEqual(stillOpen);
      expect(res.body.error.fields.colonies).toBe(`at most ${open} still open`);
    }
    // Whatever is left is less than the smallest refused offer could have had.
    expect(stillOpen).toBeLessThan(Math.max(...refused.map((r) => r.size)));
    const detail = await beekeepers[0].get(`/api/requests/${requestId}`);
    expect(detail.status).toBe(200);
    expect(detail.body.request.coloniesOpen).toBe(stillOpen);
  }, 120_000);
});
