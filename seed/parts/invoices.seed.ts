// The demo's money: Fernhollow Apiaries has billed an earlier crop in full (paid by
// transfer and check), has an overdue invoice at Cinder Ridge, has just issued one for
// colonies delivered today, and has one delivered agreement left to invoice (the demo's
// "issue the invoice" step). Own small seasons on their own blocks, all laid relative to
// world.today, so the statuses read the same on any day the demo is loaded.
import { QueryTypes } from 'sequelize';
import { buildBillableSeason, buildInvoice, buildManualPayment } from '../../tests/support/builders/invoices.js';
import { agreementSignedAt } from '../../tests/support/builders/requests.js';
import type { SeedWorld } from '../seed-world.js';
import { builderSequelize } from '../../tests/support/builders/builder-database.js';

const DAY = 86_400_000;

/** A block's name, crop and variety agree: the builders' blocks are apples until named here. */
async function nameBlock(block: { id: string }, name: string, crop: string, variety: string) {
  await builderSequelize().query('UPDATE blocks SET name = :name, crop = :crop, variety = :variety WHERE id = :id', { replacements: { id: block.id, name, crop, variety }, type: QueryTypes.UPDATE });
}

export async function seedInvoices(world: SeedWorld) {
  const { farm, farm2, apiary } = world.organizations;
  const keeper = world.users.keeper;
  const at = (days: number) => new Date(world.today.getTime() + days * DAY);
  // Each season's agreement was made and confirmed by both sides a week before its colonies came.
  const agreedBefore = (season: { agreement: { id: string } }, deliveredDays: number) => agreementSignedAt(season.agreement, at(deliveredDays - 8));

  // Paid in full: 36 colonies at $180.00. The sample of eight averages 5.7 frames, under the
  // 6 agreed, so the group falls short; four of eight sampled under 6 -> 18 colonies at half rate.
  const early = await buildBillableSeason({
    farm, apiary, colonies: 36, deliveredAt: at(-40), pickedUpAt: at(-18), pricePerColonyCents: 18_000, belowMinimumRateBp: 5000,
    framesOfBees: [6, 5, 8, 4, 5, 7, 4.5, 6], lon: -119.93, lat: 44.89,
  });
  await agreedBefore(early, -40);
  await nameBlock(early.block, 'Windbreak Galas', 'apple', 'Gala');
  const paid = await buildInvoice({ agreement: early.agreement, apiary, issuedAt: at(-40), createdBy: keeper });
  await buildManualPayment({ invoice: paid, amountCents: paid.depositCents, receivedAt: at(-39), method: 'bank-transfer', reference: 'Transfer 0412' });
  await buildManualPayment({ invoice: paid, amountCents: paid.totalCents - paid.depositCents, receivedAt: at(-6), method: 'cheque', reference: 'Check 1187' });

  // Overdue: deposit paid, the balance fell due 30 days after pickup, 28 days ago.
  const ridge = await buildBillableSeason({ farm: farm2, apiary, colonies: 24, deliveredAt: at(-80), pickedUpAt: at(-58), pricePerColonyCents: 9_500, lon: -119.83, lat: 44.96 });
  await agreedBefore(ridge, -80);
  await nameBlock(ridge.block, 'Hollow Road Cherries', 'sweet-cherry', 'Rainier');
  const overdue = await buildInvoice({ agreement: ridge.agreement, apiary, issuedAt: at(-80), createdBy: keeper });
  await buildManualPayment({ invoice: overdue, amountCents: overdue.depositCents, receivedAt: at(-78), method: 'cheque', reference: 'Check 5530' });

  // Issued today for colonies delivered today: the deposit falls due today.
  const today = await buildBillableSeason({ farm, apiary, colonies: 30, deliveredAt: world.today, pricePerColonyCents: 7_000, lon: -119.915, lat: 44.899 });
  await agreedBefore(today, 0);
  await nameBlock(today.block, "Orchard Lane d'Anjou", 'pear', "d'Anjou");
  const issued = await buildInvoice({ agreement: today.agreement, apiary, issuedAt: world.today, createdBy: keeper });

  // Delivered three days ago and not invoiced yet.
  const open = await buildBillableSeason({ farm, apiary, colonies: 20, deliveredAt: at(-3), pricePerColonyCents: 6_500, extraMoveFeeCents: 4_000, lon: -119.89, lat: 44.907 });
  await agreedBefore(open, -3);
  await nameBlock(open.block, 'Quarry Bend Granny Smith', 'apple', 'Granny Smith');

  world.extra.invoices = { paidId: paid.id, overdueId: overdue.id, issuedId: issued.id, agreementToInvoiceId: open.agreement.id };
}
