// The demo's invoices part: an issued, a paid and an overdue invoice, and one delivered
// agreement left to invoice, as the demo beekeeper and growers see them.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient } from '../support/api-client.js';
import type { SeedWorld } from '../../seed/seed-world.js';
import { seedAccounts } from '../../seed/parts/accounts.seed.js';
import { seedInvoices } from '../../seed/parts/invoices.seed.js';

describe('demo invoices seed', () => {
  let t: TestApp;
  let world: SeedWorld;
  beforeAll(async () => {
    const today = new Date();
    t = await startTestApp({ now: () => today });
    world = { today, extra: {} } as SeedWorld;
    await seedAccounts(world);
    await seedInvoices(world);
  });
  afterAll(async () => { await t?.stop(); });

  it('shows the beekeeper a paid, an overdue and an issued invoice and one agreement to invoice', async () => {
    const keeper = await signedInClient(t.app, 'keeper@apiary.test');
    const { invoices } = (await keeper.get('/api/invoices').expect(200)).body;
    const handles = world.extra.invoices as Record<string, string>;
    const statusOf = (id: string) => invoices.find((i: { id: string }) => i.id === id)?.status;
    expect(statusOf(handles.paidId)).toBe('paid');
    expect(statusOf(handles.overdueId)).toBe('overdue');
    expect(statusOf(handles.issuedId)).toBe('issued');
    expect(invoices.map((i: { number: string }) => i.number).sort()).toEqual(['INV-00001', 'INV-00002', 'INV-00003']);
    const { agreements } = (await keeper.get('/api/invoices/billable-agreements').expect(200)).body;
    expect(agreements.map((a: { id: string }) => a.id)).toEqual([handles.agreementToInvoiceId]);

    const paid = (await keeper.get(`/api/invoices/${handles.paidId}`).expect(200)).body.invoice;
    // The group's sample averages 45.5 / 8 = 5.7 frames, under 6, so it falls short (the agreement's
    // clause); 4 of 8 sampled below 6 frames -> 18 of 36 at half rate:
    // 18 x $180.00 + 18 x $90.00 = $3,240.00 + $1,620.00 = $4,860.00.
    expect(paid.totalCents).toBe(486_000);
    const overdue = (await signedInClient(t.app, 'grower2@ridge.test').then((c) => c.get(`/api/invoices/${handles.overdueId}`).expect(200))).body.invoice;
    // 24 x $95.00 = $2,280.00; balance $1,140.00 overdue for a first started month at 1%: $11.40.
    expect(overdue.outstandingCents).toBe(114_000);
    expect(overdue.accruedInterestCents).toBe(1_140);
  });
});
