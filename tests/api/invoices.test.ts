// Invoices from agreements: drafting from confirmed placements and the strength check,
// issuing with gapless numbers, PDF and e-mail, credit notes, void, scoping, reminders.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import type { Organization } from '../../server/src/db/models/organization.model.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildBillableSeason, buildInvoice, buildManualPayment } from '../support/builders/invoices.js';
import { sendOverdueReminders } from '../../server/src/modules/invoices/overdue-reminders.job.js';

describe('invoices API', () => {
  let t: TestApp;
  let clock = new Date('2027-04-20T18:00:00Z');
  let keeper: ApiClient;
  let grower: ApiClient;
  let otherKeeper: ApiClient;
  let farm: Organization;
  let apiary: Organization;
  const deliveredAt = new Date('2027-04-10T15:00:00Z'); // 10 April, 08:00 in Los Angeles
  const pickedUpAt = new Date('2027-05-01T20:00:00Z'); // 1 May, 13:00 in Los Angeles

  beforeAll(async () => {
    // The clock moves months ahead; sessions signed in now must outlive it.
    t = await startTestApp({ now: () => clock, env: { SESSION_ABSOLUTE_HOURS: String(24 * 365 * 3) } });
    farm = await buildOrganization({ kind: 'farm', name: 'Quillfield Orchard', billingEmail: 'accounts@quillfield.test' });
    apiary = await buildOrganization({ kind: 'apiary', name: 'Hollowpine Apiary', taxRateBp: 725 });
    const other = await buildOrganization({ kind: 'apiary', name: 'Other Combs' });
    await buildUser({ organization: farm, role: 'owner', email: 'owner@quillfield.test' });
    await buildUser({ organization: apiary, role: 'owner', email: 'owner@hollowpine.test' });
    await buildUser({ organization: apiary, role: 'crew', email: 'crew@hollowpine.test' });
    await buildUser({ organization: other, role: 'owner', email: 'owner@othercombs.test' });
    keeper = await signedInClient(t.app, 'owner@hollowpine.test');
    grower = await signedInClient(t.app, 'owner@quillfield.test');
    otherKeeper = await signedInClient(t.app, 'owner@othercombs.test');
  });
  afterAll(async () => { await t?.stop(); });

  it('drafts an invoice from the placements and the strength check, visible only to the beekeeper until issued', async () => {
    const season = await buildBillableSeason({
      farm, apiary, colonies: 40, deliveredAt, pickedUpAt, pricePerColonyCents: 6500, belowMinimumRateBp: 5000, extraMoveFeeCents: 2500,
      framesOfBees: [8, 5, 7, 4, 3, 6, 5, 4, 6, 8],
    });
    const res = await keeper.post('/api/invoices', { agreementId: season.agreement.id, extraMoves: 1 }).expect(201);
    const invoice = res.body.invoice;
    // The sample averages 56 / 10 = 5.6 frames < 6, so the group does not meet the agreement (Rutgers NJ: the
    // shortfall is not made up); 5 of 10 sampled under 6 frames -> 20 of 40 below minimum (PA Dept. of Agriculture / Rutgers sampling).
    // 20 x $65.00 = $1,300.00; 20 x $32.50 = $650.00; 1 move x $25.00 = $25.00; subtotal $1,975.00.
    expect(invoice.lines.map((l: { quantity: number; amountCents: number }) => [l.quantity, l.amountCents])).toEqual([[20, 130_000], [20, 65_000], [1, 2_500]]);
    // The short colonies' line reads as the agreement's shortfall clause does (common practice, no source).
    expect(invoice.lines[1].description).toMatch(/estimated from the strength check; paid at 50% of the fee\)$/);
    expect(invoice.subtotalCents).toBe(197_500);
    // Tax 7.25% of $1,975.00 = $143.1875 -> $143.19 (half up); total $2,118.19; deposit 50% = $1,059.095 -> $1,059.10.
    expect(invoice.taxCents).toBe(14_319);
    expect(invoice.totalCents).toBe(211_819);
    expect(invoice.depositCents).toBe(105_910);
    expect(invoice.depositDueOn).toBe('2027-04-10'); // a draft: the delivery day until it is issued
    expect(invoice.balanceDueOn).toBe('2027-05-31'); // 1 May + 30 days
    expect(invoice.status).toBe('draft');
    expect(invoice.number).toBeNull();
    await grower.get(`/api/invoices/${invoice.id}`).expect(404);
    await otherKeeper.get(`/api/invoices/${invoice.id}`).expect(404);
    expect((await grower.get('/api/invoices').expect(200)).body.invoices).toEqual([]);

    const again = await keeper.post('/api/invoices', { agreementId: season.agreement.id }).expect(409);
    expect(again.body.error.fields).toHaveProperty('agreementId');
    await otherKeeper.post('/api/invoices', { agreementId: season.agreement.id }).expect(404);
  });

  it('names the bad field and refuses roles without money rights', async () => {
    const bad = await keeper.post('/api/invoices', { agreementId: 'not-an-id', extraMoves: -1 }).expect(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['agreementId', 'extraMoves']));
    const crew = await signedInClient(t.app, 'crew@hollowpine.test');
    await crew.get('/api/invoices').expect(403);
    await grower.post('/api/invoices', { agreementId: '00000000-0000-4000-8000-000000000000' }).expect(403);
  });

  it('re-prices a draft, then issues it with a number, a PDF in Work Sans and an e-mail to the billing contact', async () => {
    clock = new Date('2027-04-10T17:00:00Z'); // issued on the day of delivery, deposit not yet late
    const season = await buildBillableSeason({ farm, apiary, colonies: 20, deliveredAt, pickedUpAt, pricePerColonyCents: 7000, extraMoveFeeCents: 4000 });
    const { body } = await keeper.post('/api/invoices', { agreementId: season.agreement.id }).expect(201);
    const patched = await keeper.patch(`/api/invoices/${body.invoice.id}`, { extraMoves: 2, notes: 'Two moves for the frost night.' }).expect(200);
    // 20 x $70.00 + 2 x $40.00 = $1,480.00; tax 7.25% = $107.30; total $1,587.30.
    expect(patched.body.invoice.totalCents).toBe(158_730);
    const before = t.sink.messages.length;
    const issued = await keeper.post(`/api/invoices/${body.invoice.id}/issue`, {}).expect(200);
    expect(issued.body.invoice.number).toMatch(/^INV-\d{5}$/);
    expect(issued.body.invoice.status).toBe('issued');
    // The agreement's fee clause: the deposit is due on the first delivery day, or 30 days after issue if later.
    // Issued 10 April (the delivery day) -> 10 April + 30 days = 10 May.
    expect(issued.body.invoice.depositDueOn).toBe('2027-05-10');
    await keeper.patch(`/api/invoices/${body.invoice.id}`, { extraMoves: 3 }).expect(409);
    await keeper.post(`/api/invoices/${body.invoice.id}/issue`, {}).expect(409);

    const mail = await eventually(() => t.sink.messages.slice(before).find((m) => m.subject.includes(issued.body.invoice.number)));
    expect(mail.to).toEqual(['accounts@quillfield.test']);
    expect(mail.attachments).toEqual([expect.objectContaining({ filename: `${issued.body.invoice.number}.pdf`, contentType: 'application/pdf' })]);

    const pdf = await grower.get(`/api/invoices/${body.invoice.id}/pdf`).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    }).expect(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    const bytes = pdf.body as Buffer;
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    expect(bytes.toString('latin1')).toMatch(/\/BaseFont \/[A-Z]{6}\+WorkSans/);
    clock = new Date('2027-04-20T18:00:00Z');
  });

  it('corrects an issued invoice only by credit note, and voids it only while unpaid', async () => {
    const season = await buildBillableSeason({ farm, apiary, colonies: 10, deliveredAt, pickedUpAt, pricePerColonyCents: 5000 });
    const invoice = await buildInvoice({ agreement: season.agreement, apiary, issuedAt: clock });
    // 10 x $50.00 = $500.00 + 7.25% tax $36.25 = $536.25.
    expect(invoice.totalCents).toBe(53_625);
    // Issued 20 April, ten days after the 10 April delivery: not overdue on issue; the deposit falls due 20 April + 30 days.
    const fresh = (await keeper.get(`/api/invoices/${invoice.id}`).expect(200)).body.invoice;
    expect(fresh).toMatchObject({ status: 'issued', depositDueOn: '2027-05-20', accruedInterestCents: 0 });
    const tooMuch = await keeper.post(`/api/invoices/${invoice.id}/credit-notes`, { amountCents: 53_626, reason: 'Too much' }).expect(400);
    expect(tooMuch.body.error.fields).toEqual({ amountCents: 'must be at most $536.25' });
    const credited = await keeper.post(`/api/invoices/${invoice.id}/credit-notes`, { amountCents: 5_000, reason: 'One colony arrived late' }).expect(201);
    expect(credited.body.invoice.creditNotes).toEqual([expect.objectContaining({ number: expect.stringMatching(/^CN-\d{5}$/), amountCents: 5_000 })]);
    expect(credited.body.invoice.netTotalCents).toBe(48_625);
    expect(credited.body.invoice.outstandingCents).toBe(48_625);
    await grower.post(`/api/invoices/${invoice.id}/credit-notes`, { amountCents: 100, reason: 'x' }).expect(403);

    await buildManualPayment({ invoice, amountCents: 10_000, receivedAt: clock });
    await keeper.post(`/api/invoices/${invoice.id}/void`, { reason: 'Wrong farm' }).expect(409);

    const unpaid = await buildInvoice({ agreement: (await buildBillableSeason({ farm, apiary, colonies: 5, deliveredAt })).agreement, apiary, issuedAt: clock });
    await keeper.post(`/api/invoices/${unpaid.id}/void`, {}).expect(400);
    const voided = await keeper.post(`/api/invoices/${unpaid.id}/void`, { reason: 'Issued in error' }).expect(200);
    expect(voided.body.invoice.status).toBe('void');
    expect(voided.body.invoice.outstandingCents).toBe(0);
  });

  it('gives 50 invoices issued at once 50 distinct consecutive numbers', async () => {
    const busy = await buildOrganization({ kind: 'apiary', name: 'Busy Brood Co.' });
    await buildUser({ organization: busy, role: 'owner', email: 'owner@busybrood.test' });
    const busyKeeper = await signedInClient(t.app, 'owner@busybrood.test');
    // A farm with no billing contact, so the 50 issues queue no e-mail ahead of the next tests'.
    const quietFarm = await buildOrganization({ kind: 'farm', name: 'Quiet Rows Farm' });
    const drafts: string[] = [];
    for (let batch = 0; batch < 5; batch += 1) {
      drafts.push(...await Promise.all(Array.from({ length: 10 }, async (_, i) => {
        const season = await buildBillableSeason({ farm: quietFarm, apiary: busy, colonies: 2, deliveredAt, lon: -119.9 + (batch * 10 + i) * 0.01 });
        return (await buildInvoice({ agreement: season.agreement, apiary: busy })).id;
      })));
    }
    const answers = await Promise.all(drafts.map((id) => busyKeeper.post(`/api/invoices/${id}/issue`, {})));
    expect(answers.map((a) => a.status)).toEqual(drafts.map(() => 200));
    const numbers = answers.map((a) => Number(a.body.invoice.number.slice(4))).sort((a, b) => a - b);
    expect(numbers).toEqual(Array.from({ length: 50 }, (_, i) => i + 1));
  });

  it('turns overdue after the due date, accrues simple interest per started month and reminds at most once per interval', async () => {
    const late = await buildOrganization({ kind: 'farm', name: 'Slowpay Acres', billingEmail: 'ap@slowpay.test' });
    await buildUser({ organization: late, role: 'owner', email: 'owner@slowpay.test' });
    const lateGrower = await signedInClient(t.app, 'owner@slowpay.test');
    const season = await buildBillableSeason({ farm: late, apiary, colonies: 40, deliveredAt, pickedUpAt, pricePerColonyCents: 6500, lateInterestBpPerMonth: 100 });
    const invoice = await buildInvoice({ agreement: season.agreement, apiary, issuedAt: clock });
    // $2,600.00 + 7.25% = $2,788.50; deposit $1,394.25 due 20 May (issued 20 April + 30 days); balance $1,394.25 due 31 May.
    await buildManualPayment({ invoice, amountCents: invoice.depositCents, receivedAt: clock });
    clock = new Date('2027-05-20T18:00:00Z');
    expect((await lateGrower.get(`/api/invoices/${invoice.id}`).expect(200)).body.invoice.status).toBe('partly-paid');

    clock = new Date('2027-07-15T19:00:00Z'); // 15 July: 2 started months since 1 June
    const overdue = (await lateGrower.get(`/api/invoices/${invoice.id}`).expect(200)).body.invoice;
    expect(overdue.status).toBe('overdue');
    // 1%/month (UF/IFAS EDIS Sample Pollination Agreement 2015): $1,394.25 x 1% x 2 = $27.885 -> $27.89.
    expect(overdue.accruedInterestCents).toBe(2_789);

    const before = t.sink.messages.length;
    const firstRun = await sendOverdueReminders(t.context);
    expect(firstRun).toBeGreaterThanOrEqual(1);
    expect(await sendOverdueReminders(t.context)).toBe(0);
    const reminder = await eventually(() => t.sink.messages.slice(before).find((m) => m.to.includes('ap@slowpay.test')));
    expect(reminder.subject).toContain('overdue');
    expect(reminder.text).toContain('$27.89');

    clock = new Date('2027-07-20T19:00:00Z'); // 5 days later: inside the 7-day interval
    expect(await sendOverdueReminders(t.context)).toBe(0);
    clock = new Date('2027-07-22T20:00:00Z'); // 7 days and 1 hour later
    expect(await sendOverdueReminders(t.context)).toBeGreaterThanOrEqual(1);
    await eventually(() => t.sink.messages.slice(before).filter((m) => m.to.includes('ap@slowpay.test')).length === 2);
    clock = new Date('2027-04-20T18:00:00Z');
  });

  it('reports receivables by grower, status and week, payables per acre, and CSV', async () => {
    clock = new Date('2027-05-05T18:00:00Z');
    const receivables = (await keeper.get('/api/invoices/receivables?season=2027').expect(200)).body;
    expect(receivables.byGrower.map((g: { farmName: string }) => g.farmName)).toEqual(expect.arrayContaining(['Quillfield Orchard', 'Slowpay Acres']));
    const outstandingSum = receivables.byGrower.reduce((n: number, g: { outstandingCents: number }) => n + g.outstandingCents, 0);
    expect(receivables.seasonTotals.outstandingCents).toBe(outstandingSum);
    expect(receivables.seasonTotals.invoicedCents - receivables.seasonTotals.receivedCents).toBe(outstandingSum);
    const expected = receivables.weekly.reduce((n: number, w: { expectedCents: number }) => n + w.expectedCents, 0);
    expect(expected).toBe(receivables.seasonTotals.invoicedCents);
    expect(receivables.weekly.every((w: { weekStart: string }) => new Date(`${w.weekStart}T12:00:00Z`).getUTCDay() === 1)).toBe(true);
    await grower.get('/api/invoices/receivables').expect(403);

    const payables = (await grower.get('/api/invoices/payables?season=2027').expect(200)).body;
    expect(payables.blocks.length).toBeGreaterThan(0);
    for (const b of payables.blocks) expect(b.costPerAcreCents).toBe(Math.round(b.costCents / b.acres));
    const blockSum = payables.blocks.reduce((n: number, b: { costCents: number }) => n + b.costCents, 0);
    expect(Math.abs(blockSum - payables.totals.invoicedCents)).toBeLessThanOrEqual(payables.blocks.length);

    const csv = await keeper.get('/api/invoices/export.csv').expect(200);
    expect(csv.headers['content-type']).toContain('text/csv');
    const lines = csv.text.trim().split('\r\n');
    expect(lines[0]).toBe('number,status,season,grower,beekeeper,currency,total,credited,net_total,paid,outstanding,deposit,deposit_due_on,balance_due_on,late_interest_accrued,issued_at');
    expect(lines.some((l) => l.includes('Slowpay Acres') && l.includes('2788.50'))).toBe(true);
    const payments = await grower.get('/api/payments/export.csv').expect(200);
    expect(payments.text.split('\r\n')[0]).toBe('invoice,grower,method,state,currency,amount,refunded,reference,received_at');
  });
});
