// Authorization rows for /api/invoices and /api/payments: owners, managers and viewers of
// both sides read; the beekeeper's owner and manager draft, issue, void, credit, record
// cheques and refund; the grower's owner and manager pay online; crew, applicators and the
// admin see no money. Another organization gets 404 for these invoices (or its own, empty lists).
import { QueryTypes } from 'sequelize';
import { buildBillableSeason, buildInvoice } from '../../support/builders/invoices.js';
import { each, statuses, type AuthzRow, type AuthzRowFile, type AuthzWorld } from './authz-row.js';
import { builderSequelize } from '../../support/builders/builder-database.js';

interface Fixtures { issuedId: string; draftId: string; onlinePaymentId: string }

const readers = ['farm:owner', 'farm:manager', 'farm:viewer', 'apiary:owner', 'apiary:manager', 'apiary:viewer'] as const;
const keepers = ['apiary:owner', 'apiary:manager'] as const;
const payers = ['farm:owner', 'farm:manager'] as const;
let spot = 0;

async function season(world: Pick<AuthzWorld, 'own'>) {
  spot += 1;
  return buildBillableSeason({ farm: world.own.farm, apiary: world.own.apiary, colonies: 4, deliveredAt: new Date(), pricePerColonyCents: 6000, lon: -121.2 + spot * 0.001, lat: 45.1 });
}

async function invoice(world: Pick<AuthzWorld, 'own'>, issued: boolean) {
  return (await buildInvoice({ agreement: (await season(world)).agreement, apiary: world.own.apiary, issuedAt: issued ? new Date() : undefined })).id;
}

const freshDraft = async ({ world }: { world: Pick<AuthzWorld, 'own'> }) => ({ id: await invoice(world, false) });
const freshIssued = async ({ world }: { world: Pick<AuthzWorld, 'own'> }) => ({ id: await invoice(world, true) });
const freshAgreement = async ({ world }: { world: Pick<AuthzWorld, 'own'> }) => ({ id: (await season(world)).agreement.id });

const file: AuthzRowFile<Fixtures> = {
  async setup(world) {
    const issuedId = await invoice(world, true);
    const [payment] = await builderSequelize().query<{ id: string }>(
      `INSERT INTO payments (invoice_id, method, state, amount_cents, currency, provider_payment_id, received_at)
       VALUES (:issuedId, 'online', 'succeeded', 100, 'USD', 'pi_test_authz_row', now()) RETURNING id`,
      { replacements: { issuedId }, type: QueryTypes.SELECT },
    );
    return { issuedId, draftId: await invoice(world, false), onlinePaymentId: payment.id };
  },
  rows: [],
};

const readRow = (title: string, path: (f: Fixtures) => string): AuthzRow<Fixtures> => ({
  title, method: 'GET', path: ({ fixtures }) => path(fixtures), policy: { table: 'invoices', action: 'read' },
  expect: statuses(403, { ...each(readers, 200), 'other-farm': 404, 'other-apiary': 404 }),
});

const rows: AuthzRow<Fixtures>[] = [
  {
    title: 'list invoices', method: 'GET', path: '/api/invoices', policy: { table: 'invoices', action: 'read' },
    expect: statuses(403, { ...each(readers, 200), 'other-farm': 200, 'other-apiary': 200 }),
  },
  {
    title: 'export invoices as CSV', method: 'GET', path: '/api/invoices/export.csv', policy: { table: 'invoices', action: 'read' },
    expect: statuses(403, { ...each(readers, 200), 'other-farm': 200, 'other-apiary': 200 }),
  },
  readRow('read an issued invoice', (f) => `/api/invoices/${f.issuedId}`),
  readRow('download an issued invoice as PDF', (f) => `/api/invoices/${f.issuedId}/pdf`),
  {
    // A draft is the beekeeper's until issued: the grower's side gets 404 like a stranger.
    title: 'read a draft', method: 'GET', path: ({ fixtures }) => `/api/invoices/${fixtures.draftId}`, policy: { table: 'invoices', action: 'read' },
    expect: statuses(403, { ...each(readers, 404), 'apiary:owner': 200, 'apiary:manager': 200, 'apiary:viewer': 200, 'other-farm': 404, 'other-apiary': 404 }),
  },
  {
    title: 'receivables of the apiary business', method: 'GET', path: '/api/invoices/receivables', policy: { table: 'invoices', action: 'receivables' },
    expect: statuses(403, { 'apiary:owner': 200, 'apiary:manager': 200, 'apiary:viewer': 200, 'other-apiary': 200 }),
  },
  {
    title: 'payables and cost per acre of the farm', method: 'GET', path: '/api/invoices/payables', policy: { table: 'invoices', action: 'payables' },
    expect: statuses(403, { 'farm:owner': 200, 'farm:manager': 200, 'farm:viewer': 200, 'other-farm': 200 }),
  },
  {
    title: 'agreements ready to invoice', method: 'GET', path: '/api/invoices/billable-agreements', policy: { table: 'invoices', action: 'draft' },
    expect: statuses(403, { ...each(keepers, 200), 'other-apiary': 200 }),
  },
  {
    title: 'draft an invoice from an agreement', method: 'POST', path: '/api/invoices', policy: { table: 'invoices', action: 'draft' },
    fresh: freshAgreement, body: ({ fresh }) => ({ agreementId: fresh.id }),
    expect: statuses(403, { ...each(keepers, 201), 'other-apiary': 404 }),
  },
  {
    title: 'change a draft', method: 'PATCH', path: ({ fresh }) => `/api/invoices/${fresh.id}`, policy: { table: 'invoices', action: 'draft' },
    fresh: freshDraft, body: { extraMoves: 1 },
    expect: statuses(403, { ...each(keepers, 200), 'other-apiary': 404 }),
  },
  {
    title: 'discard a draft', method: 'DELETE', path: ({ fresh }) => `/api/invoices/${fresh.id}`, policy: { table: 'invoices', action: 'draft' },
    fresh: freshDraft,
    expect: statuses(403, { ...each(keepers, 204), 'other-apiary': 404 }),
  },
  {
    title: 'issue a draft', method: 'POST', path: ({ fresh }) => `/api/invoices/${fresh.id}/issue`, policy: { table: 'invoices', action: 'issue' },
    fresh: freshDraft, body: {},
    expect: statuses(403, { ...each(keepers, 200), 'other-apiary': 404 }),
  },
  {
    title: 'void an unpaid invoice', method: 'POST', path: ({ fresh }) => `/api/invoices/${fresh.id}/void`, policy: { table: 'invoices', action: 'void' },
    fresh: freshIssued, body: { reason: 'Issued in error' },
    expect: statuses(403, { ...each(keepers, 200), 'other-apiary': 404 }),
  },
  {
    title: 'add a credit note', method: 'POST', path: ({ fixtures }) => `/api/invoices/${fixtures.issuedId}/credit-notes`, policy: { table: 'invoices', action: 'creditNote' },
    body: { amountCents: 1, reason: 'Rounding' },
    expect: statuses(403, { ...each(keepers, 201), 'other-apiary': 404 }),
  },
  {
    title: 'start an online payment', method: 'POST', path: '/api/payments/checkout', policy: { table: 'payments', action: 'payOnline' },
    body: ({ fixtures }) => ({ invoiceId: fixtures.issuedId }),
    expect: statuses(403, { ...each(payers, 201), 'other-farm': 404 }),
  },
  {
    title: 'record a cheque', method: 'POST', path: '/api/payments', policy: { table: 'payments', action: 'recordManual' },
    body: ({ fixtures }) => ({ invoiceId: fixtures.issuedId, method: 'cheque', amountCents: 100, receivedOn: '2020-01-02' }),
    expect: statuses(403, { ...each(keepers, 201), 'other-apiary': 404 }),
  },
  {
    // Past authorization the refund is refused for its amount (more than was paid), which the payments service never sees.
    title: 'refund an online payment', method: 'POST', path: ({ fixtures }) => `/api/payments/${fixtures.onlinePaymentId}/refunds`, policy: { table: 'payments', action: 'refund' },
    body: { amountCents: 1_000_000 },
    expect: statuses(403, { ...each(keepers, 400), 'other-apiary': 404 }),
  },
  {
    title: 'export payments as CSV', method: 'GET', path: '/api/payments/export.csv', policy: { table: 'payments', action: 'export' },
    expect: statuses(403, { ...each(readers, 200), 'other-farm': 200, 'other-apiary': 200 }),
  },
];

file.rows = rows;
export const { setup } = file;
export { rows };
