// Builders for invoices and payments: a picked-up season ready to bill, drafts and issued
// invoices made by the same drafting code the server uses, and recorded payments.
import { QueryTypes, type Sequelize } from 'sequelize';
import { loadAgreement, insertDraft, issueDraft } from '../../../server/src/modules/invoices/invoice-drafting.js';
import { buildSignedSeason, buildStrengthCheck, type RequestTerms } from './season.js';
import { buildOrganization, buildUser } from './accounts.js';
import { builderDatabase, builderModels, builderSequelize } from './builder-database.js';

type Org = { id: string };

function db(): Sequelize {
  const sequelize = builderSequelize();
  if (!sequelize) throw new Error('models are not initialised: start the test app first');
  return sequelize;
}

/** Marks a delivered placement picked up (its on-site range closes at pickup). */
export async function pickUpPlacement(placement: { id: string }, at: Date) {
  await db().query(
    `UPDATE placements SET state = 'picked-up', picked_up_at = :at, colonies_picked_up = colonies_delivered,
       on_site = tstzrange(delivered_at, :at::timestamptz, '[)') WHERE id = :id`,
    { replacements: { id: placement.id, at: at.toISOString() } },
  );
}

/** A signed season delivered at `deliveredAt`, optionally strength-checked and picked up. */
export async function buildBillableSeason(attrs: {
  farm: Org; apiary: Org; colonies?: number; deliveredAt: Date; pickedUpAt?: Date; framesOfBees?: number[]; lon?: number; lat?: number;
} & RequestTerms) {
  const colonies = attrs.colonies ?? 40;
  const season = await buildSignedSeason({
    ...attrs, colonies, onSite: { from: attrs.deliveredAt, to: attrs.pickedUpAt ?? new Date(attrs.deliveredAt.getTime() + 21 * 86_400_000) },
  });
  if (attrs.framesOfBees) {
    await buildStrengthCheck({ placement: season.placement, coloniesInGroup: colonies, framesOfBees: attrs.framesOfBees, checkedAt: new Date(attrs.deliveredAt.getTime() + 86_400_000) });
  }
  if (attrs.pickedUpAt) await pickUpPlacement(season.placement, attrs.pickedUpAt);
  return season;
}

/** A draft (or, with issuedAt, an issued) invoice for an agreement of the apiary. */
export async function buildInvoice(attrs: { agreement: { id: string }; apiary: Org; extraMoves?: number; issuedAt?: Date; createdBy?: { id: string } | null }) {
  const database = builderDatabase();
  const sequelize = database.sequelize;
  const agreement = await loadAgreement(database, attrs.apiary.id, attrs.agreement.id);
  const id = await sequelize.transaction((transaction) =>
    insertDraft(database, agreement, { extraMoves: attrs.extraMoves ?? 0, createdBy: attrs.createdBy?.id ?? null }, transaction));
  const number = attrs.issuedAt ? await issueDraft(database, id, attrs.apiary.id, attrs.createdBy?.id ?? null, attrs.issuedAt) : null;
  const [row] = await sequelize.query<{ total_cents: number; deposit_cents: number }>('SELECT total_cents, deposit_cents FROM invoices WHERE id = :id', {
    replacements: { id }, type: QueryTypes.SELECT,
  });
  return { id, number, totalCents: row.total_cents, depositCents: row.deposit_cents };
}

/** A cheque or bank transfer the beekeeper has recorded. */
export async function buildManualPayment(attrs: { invoice: { id: string }; amountCents: number; receivedAt: Date; method?: 'cheque' | 'bank-transfer'; reference?: string }) {
  return builderModels().Payment.create({
    invoiceId: attrs.invoice.id, method: attrs.method ?? 'cheque', state: 'succeeded', amountCents: attrs.amountCents, currency: 'USD',
    providerPaymentId: null, failureMessage: null, reference: attrs.reference ?? null, receivedAt: attrs.receivedAt, recordedBy: null,
  });
}

/** A farm and an apiary business with one owner each: the two sides of a bill. */
export async function buildBillingParties(names: { farm: string; apiary: string; farmOwnerEmail: string; apiaryOwnerEmail: string }) {
  const farm = await buildOrganization({ kind: 'farm', name: names.farm });
  const apiary = await buildOrganization({ kind: 'apiary', name: names.apiary });
  await buildUser({ organization: farm, role: 'owner', email: names.farmOwnerEmail });
  await buildUser({ organization: apiary, role: 'owner', email: names.apiaryOwnerEmail });
  return { farm, apiary };
}
