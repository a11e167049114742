// The demo's hive requests, agreements and placements, laid around world.today: yards for
// both apiaries; an open request on the Braeburn with a price offer waiting for the
// grower; an open request at Cinder Ridge nobody has answered; the pear block in bloom
// split between Fernhollow (delivered three days ago, strength checked) and Brightcomb
// (not yet delivered); an agreement on the Fuji waiting for the beekeeper to confirm;
// last month's cherries picked up and completed; and a draft.
import { buildAgreement, buildCommitment, buildDropSite, buildPlacement, buildRequest, buildStrengthCheck, buildYard, type BuiltBlock } from '../../tests/support/builders/season.js';
import { agreementMadeAt, agreementSignedAt, buildRequestEvent, confirmAgreementSide, fillAgreementClauses } from '../../tests/support/builders/requests.js';
import type { SeedBlocks } from './blocks.seed.js';
import type { SeedWorld } from '../seed-world.js';

const DAY = 86_400_000;
const HOUR = 3_600_000;

export async function seedRequests(world: SeedWorld) {
  const handles = world.extra.blocks as SeedBlocks | undefined;
  if (!handles) return;
  const { farm, farm2, apiary, apiary2 } = world.organizations;
  const { grower, grower2, keeper, keeper2, crew } = world.users;
  const { benchPear, benchBraeburn, benchCherry, benchGala, ridgeFuji, ridgePlum } = handles.blocks;
  const dayStart = Date.UTC(world.today.getUTCFullYear(), world.today.getUTCMonth(), world.today.getUTCDate());
  const at = (days: number, hours = 0) => new Date(dayStart + days * DAY + hours * HOUR);
  const site = (block: BuiltBlock, dLon: number, dLat = 0) => ({ lon: block.lon + dLon, lat: block.lat + dLat });

  await buildYard({ apiary, name: 'Fernhollow home yard', lon: -119.86, lat: 44.93, colonies: 800 });
  await buildYard({ apiary, name: 'Old mill winter yard', lon: -119.98, lat: 44.87, colonies: 400 });
  await buildYard({ apiary: apiary2, name: 'Brightcomb yard', lon: -119.75, lat: 44.99, colonies: 450 });

  const opened = async (request: { id: string }, by: { id: string }, days: number) => {
    await buildRequestEvent(request, by, 'created', at(days));
    await buildRequestEvent(request, by, 'opened', at(days, 1));
  };

  // The pear block in bloom, split between the two apiaries.
  const pear = await buildRequest({ farm, blocks: [{ block: benchPear, colonies: 40 }], state: 'filled', title: 'Millrace Pears in bloom', onSite: { from: at(-3), to: at(12) }, createdBy: grower, pricePerColonyCents: 7_200, respondBy: null });
  await opened(pear, grower, -14);
  const pearNorth = await buildDropSite({ request: pear, block: benchPear, name: 'Millrace north lane', ...site(benchPear, 0.0008), coloniesPlanned: 24, gateCode: '2871' });
  const pearSouth = await buildDropSite({ request: pear, block: benchPear, name: 'Millrace south gate', ...site(benchPear, -0.0006, -0.0005), coloniesPlanned: 16, gateCode: '2871' });
  const pearA = await buildCommitment({ request: pear, apiary, colonies: 24, createdBy: keeper });
  const pearB = await buildCommitment({ request: pear, apiary: apiary2, colonies: 16, createdBy: keeper2 });
  await buildRequestEvent(pear, keeper, 'commitment-offered', at(-12), { colonies: 24 });
  await buildRequestEvent(pear, keeper2, 'commitment-offered', at(-11), { colonies: 16 });
  await buildRequestEvent(pear, null, 'fully-committed', at(-11), { coloniesOpen: 0 });
  const pearAgreementA = await buildAgreement({ commitment: pearA, state: 'in-force', farmConfirmedBy: grower, apiaryConfirmedBy: keeper });
  const pearAgreementB = await buildAgreement({ commitment: pearB, state: 'in-force', farmConfirmedBy: grower, apiaryConfirmedBy: keeper2 });
  for (const a of [pearAgreementA, pearAgreementB]) await fillAgreementClauses(a);
  // Agreed the day the request filled, a week before the colonies came.
  await agreementSignedAt(pearAgreementA, at(-11, 3));
  await agreementSignedAt(pearAgreementB, at(-11, 4));
  const pearPlaced = await buildPlacement({ agreement: pearAgreementA, dropSite: pearNorth, coloniesPlanned: 24, deliveredAt: at(-3, 4), coloniesDelivered: 24 });
  await buildStrengthCheck({ placement: pearPlaced, coloniesInGroup: 24, framesOfBees: [8, 7, 9, 5.5], checkedAt: at(-2, 18), checkedBy: crew });
  const pearWaiting = await buildPlacement({ agreement: pearAgreementB, dropSite: pearSouth, coloniesPlanned: 16 });

  // Open on the Braeburn: Brightcomb offers 12 colonies at a higher price, 24 still open.
  const braeburn = await buildRequest({ farm, blocks: [{ block: benchBraeburn, colonies: 36 }], state: 'listed', title: 'Creekside Braeburn, first king bloom', onSite: { from: at(1), to: at(16) }, createdBy: grower, pricePerColonyCents: 6_800, respondBy: new Date(dayStart + 2 * DAY).toISOString().slice(0, 10) });
  await opened(braeburn, grower, -5);
  await buildDropSite({ request: braeburn, block: benchBraeburn, name: 'Creek bend', ...site(benchBraeburn, 0.0005), coloniesPlanned: 36, gateCode: '5530' });
  await buildCommitment({ request: braeburn, apiary: apiary2, colonies: 12, state: 'offered', proposedPriceCents: 7_400, createdBy: keeper2 });
  await buildRequestEvent(braeburn, keeper2, 'commitment-offered', at(-1), { colonies: 12, proposedPriceCents: 7_400 });

  // Open at Cinder Ridge, nobody has answered yet.
  const plums = await buildRequest({ farm: farm2, blocks: [{ block: ridgePlum, colonies: 16 }], state: 'listed', title: 'Ash Hollow Plums', onSite: { from: at(4), to: at(18) }, createdBy: grower2, pricePerColonyCents: 6_000 });
  await opened(plums, grower2, -2);
  await buildDropSite({ request: plums, block: ridgePlum, name: 'Hollow track end', ...site(ridgePlum, 0.0004), coloniesPlanned: 16 });

  // The Fuji: Fernhollow committed all 45; Cinder Ridge confirmed, Fernhollow has not yet.
  const fuji = await buildRequest({ farm: farm2, blocks: [{ block: ridgeFuji, colonies: 45 }], state: 'filled', title: 'Ridge Top Fuji', onSite: { from: at(2), to: at(17) }, createdBy: grower2, pricePerColonyCents: 6_900 });
  await opened(fuji, grower2, -6);
  await buildDropSite({ request: fuji, block: ridgeFuji, name: 'Ridge windbreak', ...site(ridgeFuji, 0.0007), coloniesPlanned: 45, gateCode: '9042' });
  const fujiCommitment = await buildCommitment({ request: fuji, apiary, colonies: 45, createdBy: keeper });
  const fujiAgreement = await buildAgreement({ commitment: fujiCommitment, state: 'awaiting-signatures' });
  await fillAgreementClauses(fujiAgreement);
  await agreementMadeAt(fujiAgreement, at(-3, 5));
  await confirmAgreementSide(fujiAgreement, 'farm', grower2, at(-1, 2));

  // Last month's cherries: delivered, checked, picked up, completed.
  const cherries = await buildRequest({ farm, blocks: [{ block: benchCherry, colonies: 30 }], state: 'filled', title: 'South Slope Cherries', onSite: { from: at(-24), to: at(-6) }, createdBy: grower, pricePerColonyCents: 8_000 });
  await opened(cherries, grower, -40);
  const cherrySite = await buildDropSite({ request: cherries, block: benchCherry, name: 'Slope road pull-out', ...site(benchCherry, 0.0006), coloniesPlanned: 30 });
  const cherryAgreement = await buildAgreement({ commitment: await buildCommitment({ request: cherries, apiary, colonies: 30, createdBy: keeper }), state: 'completed', farmConfirmedBy: grower, apiaryConfirmedBy: keeper });
  await fillAgreementClauses(cherryAgreement);
  await agreementSignedAt(cherryAgreement, at(-34, 2));
  const cherryPlaced = await buildPlacement({ agreement: cherryAgreement, dropSite: cherrySite, coloniesPlanned: 30, deliveredAt: at(-24, 5), pickedUpAt: at(-6, 4), coloniesDelivered: 30, coloniesPickedUp: 30 });
  await buildStrengthCheck({ placement: cherryPlaced, coloniesInGroup: 30, framesOfBees: [7, 8, 6, 9], checkedAt: at(-22, 17), checkedBy: crew });

  // A draft the grower has not opened yet.
  const draft = await buildRequest({ farm, blocks: [{ block: benchGala, colonies: 36 }], state: 'draft', title: 'Upper Bench Gala (draft)', onSite: { from: at(3), to: at(18) }, createdBy: grower, pricePerColonyCents: 6_500 });
  await buildRequestEvent(draft, grower, 'created', at(0));

  world.extra.requests = {
    splitRequestId: pear.id, openRequestId: braeburn.id, unansweredRequestId: plums.id, awaitingAgreementId: fujiAgreement.id,
    deliveredPlacementId: pearPlaced.id, scheduledPlacementId: pearWaiting.id, pickedUpPlacementId: cherryPlaced.id, draftRequestId: draft.id,
  };
}
