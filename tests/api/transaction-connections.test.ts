// Every query a managed transaction's work runs is given that transaction, so it runs on
// the transaction's own connection: saving a spray plan (the plan's row is locked while the
// conflict check reads the colonies near it) and issuing an invoice (the number counter is
// locked).
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildAlertWorld, type AlertWorld } from '../support/alert-world.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildBillableSeason } from '../support/builders/invoices.js';
import { guardTransactions } from '../support/transaction-guard.js';

describe('queries inside a transaction', () => {
  let t: TestApp;
  let guard: ReturnType<typeof guardTransactions>;
  let world: AlertWorld;
  let grower: ApiClient;

  beforeAll(async () => {
    t = await startTestApp();
    world = await buildAlertWorld('txconn');
    grower = await signedInClient(t.app, world.growerEmail);
    guard = guardTransactions();
  });
  afterAll(async () => {
    guard?.stop();
    await t?.stop();
  });

  it('sees a query that is not given the transaction (the check itself)', async () => {
    const before = guard.strays.length;
    await t.context.sequelize.transaction(async (transaction) => {
      await t.context.models.Organization.count({ transaction });
      await t.context.models.Organization.count();
    });
    expect(guard.strays.slice(before)).toHaveLength(1);
    guard.strays.splice(before);
  });

  it('saves, changes and cancels a conflicting spray plan with every query on the transaction', async () => {
    const saved = (await grower.post('/api/sprays', world.conflictingSpray(0, 'Ridgeline 4F')).expect(201)).body;
    expect(saved.check.conflicts.length).toBeGreaterThan(0);
    await grower.patch(`/api/sprays/${saved.spray.id}`, world.conflictingSpray(1, 'Ridgeline 4F')).expect(200);
    await grower.post(`/api/sprays/${saved.spray.id}/cancel`).expect(200);
    expect(guard.strays).toEqual([]);
  });

  it('drafts, issues and credits an invoice with every query on the transaction', async () => {
    const farm = await buildOrganization({ kind: 'farm', name: 'Countersink Orchard' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Numberline Apiary' });
    await buildUser({ organization: apiary, role: 'owner', email: 'owner@numberline.test' });
    const season = await buildBillableSeason({ farm, apiary, colonies: 12, deliveredAt: new Date('2027-03-02T16:00:00Z'), pricePerColonyCents: 6000 });
    const keeper = await signedInClient(t.app, 'owner@numberline.test');
    const invoice = (await keeper.post('/api/invoices', { agreementId: season.agreement.id, extraMoves: 0 }).expect(201)).body.invoice;
    await keeper.post(`/api/invoices/${invoice.id}/issue`, {}).expect(200);
    await keeper.post(`/api/invoices/${invoice.id}/credit-notes`, { amountCents: 500, reason: 'A colony was weak' }).expect(201);
    expect(guard.strays).toEqual([]);
  });
});
