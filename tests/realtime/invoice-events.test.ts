// An invoice change is told to the sockets of the businesses that see the invoice: a draft
// to the apiary business that wrote it only, an issued, voided or credited invoice to both
// sides, and to nobody else.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { signIn, withSession, openSocket, type AppSocket, type Session } from '../support/realtime-client.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildBillableSeason } from '../support/builders/invoices.js';

function recordInvoiceIds(socket: AppSocket): string[] {
  const ids: string[] = [];
  socket.on('invoice:updated', ({ invoiceId }) => ids.push(invoiceId));
  return ids;
}

describe('invoice:updated', () => {
  let t: TestApp;
  let keeper: Session;
  const sockets: AppSocket[] = [];
  let heard: { apiary: string[]; farm: string[]; stranger: string[] };
  let agreementId: string;

  beforeAll(async () => {
    t = await startTestApp();
    const farm = await buildOrganization({ kind: 'farm', name: 'Ledgerwood Orchard' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Tallycomb Apiary' });
    const other = await buildOrganization({ kind: 'farm', name: 'Elsewhere Orchard' });
    await buildUser({ organization: farm, role: 'owner', email: 'owner@ledgerwood.test' });
    await buildUser({ organization: apiary, role: 'owner', email: 'owner@tallycomb.test' });
    await buildUser({ organization: other, role: 'owner', email: 'owner@elsewhere.test' });
    const season = await buildBillableSeason({ farm, apiary, colonies: 10, deliveredAt: new Date('2027-03-01T16:00:00Z'), pricePerColonyCents: 5000 });
    agreementId = season.agreement.id;
    keeper = await signIn(t.baseUrl, 'owner@tallycomb.test');
    const [apiarySocket, farmSocket, strangerSocket] = await Promise.all(
      [keeper, await signIn(t.baseUrl, 'owner@ledgerwood.test'), await signIn(t.baseUrl, 'owner@elsewhere.test')].map((s) => openSocket(t.baseUrl, s)),
    );
    sockets.push(apiarySocket, farmSocket, strangerSocket);
    heard = { apiary: recordInvoiceIds(apiarySocket), farm: recordInvoiceIds(farmSocket), stranger: recordInvoiceIds(strangerSocket) };
  });
  afterAll(async () => {
    for (const s of sockets) s.disconnect();
    await t?.stop();
  });

  it('tells the apiary business of a draft, and both sides once it is issued and credited', async () => {
    const api = withSession(t.baseUrl, keeper);
    const draft = (await api.post('/api/invoices').send({ agreementId, extraMoves: 0 }).expect(201)).body.invoice;
    await eventually(() => heard.apiary.includes(draft.id));

    await api.post(`/api/invoices/${draft.id}/issue`).send({}).expect(200);
    await eventually(() => heard.farm.includes(draft.id) && heard.apiary.filter((id) => id === draft.id).length >= 2);

    await api.post(`/api/invoices/${draft.id}/credit-notes`).send({ amountCents: 1000, reason: 'One colony arrived late' }).expect(201);
    await eventually(() => heard.farm.filter((id) => id === draft.id).length >= 2 && heard.apiary.filter((id) => id === draft.id).length >= 3);

    // The farm heard nothing of the draft: only of the issued invoice and its credit note.
    expect(heard.farm.filter((id) => id === draft.id)).toHaveLength(2);
    expect(heard.stranger).toEqual([]);
  });
});
