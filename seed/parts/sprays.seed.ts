// The demo's sprays: a planned spray on the pear block in bloom next to placed colonies
// (the check raises an alert for the farm and the apiary), one applied a few days ago with
// a low-toxicity product, and one cancelled; codling moth trap counts with a biofix.
// Seeding runs without a server: alerts are stored and e-mails are not sent.
import { QueryTypes } from 'sequelize';
import { pino } from 'pino';
import { loadConfig } from '../../server/src/config/env.js';
import { createJobQueue } from '../../server/src/jobs/queue.js';
import type { AppContext, RealtimeServer } from '../../server/src/context.js';
import { buildAgreement, buildCommitment, buildDropSite, buildPlacement, buildRequest, type BuiltBlock } from '../../tests/support/builders/season.js';
import { applySpray, cancelSpray, planSpray, sprayInput } from '../../tests/support/builders/sprays.js';
import { agreementSignedAt } from '../../tests/support/builders/requests.js';
import type { SeedBlocks } from './blocks.seed.js';
import type { SeedWorld } from '../seed-world.js';
import { builderModels, builderSequelize } from '../../tests/support/builders/builder-database.js';

const DAY = 86_400_000;
const HOUR = 3_600_000;

/** Nobody is connected while seeding: events go nowhere. */
const silentRealtime = { to: () => ({ emit: () => true }) } as unknown as RealtimeServer;

async function seedContext(today: Date): Promise<AppContext> {
  const logger = pino({ level: 'silent' });
  return { config: loadConfig(), sequelize: builderSequelize(), models: builderModels(), io: silentRealtime, jobs: await createJobQueue('', logger, false), logger, now: () => today };
}

/** Colonies near the block: placed by the requests part, or a small group placed here when it placed none. */
async function ensureColoniesNear(world: SeedWorld, block: BuiltBlock) {
  const [{ n }] = await builderSequelize().query<{ n: number }>(
    `SELECT count(*)::int AS n FROM placements p JOIN drop_sites d ON d.id = p.drop_site_id JOIN blocks b ON b.id = :blockId
     WHERE ST_DWithin(d.location::geography, coalesce(b.outline, b.location)::geography, 1609.344) AND p.on_site @> CAST(:today AS timestamptz)`,
    { replacements: { blockId: block.id, today: world.today.toISOString() }, type: QueryTypes.SELECT },
  );
  if (n > 0) return;
  const onSite = { from: new Date(world.today.getTime() - 3 * DAY), to: new Date(world.today.getTime() + 12 * DAY) };
  const request = await buildRequest({ farm: world.organizations.farm, blocks: [{ block, colonies: 16 }], state: 'filled', title: 'Pear bloom colonies', onSite, createdBy: world.users.grower });
  const dropSite = await buildDropSite({ request, block, name: 'Pear lane gate', lon: block.lon + 0.0008, lat: block.lat, coloniesPlanned: 16 });
  const agreement = await buildAgreement({ commitment: await buildCommitment({ request, apiary: world.organizations.apiary, colonies: 16 }) });
  await agreementSignedAt(agreement, new Date(onSite.from.getTime() - 8 * DAY));
  await buildPlacement({ agreement, dropSite, coloniesPlanned: 16, deliveredAt: onSite.from });
}

export async function seedSprays(world: SeedWorld) {
  const handles = world.extra.blocks as SeedBlocks | undefined;
  if (!handles) return;
  const { benchPear, benchGala, benchBraeburn } = handles.blocks;
  const ctx = await seedContext(world.today);
  const applicator = world.users.applicator;
  const dayStart = Date.UTC(world.today.getUTCFullYear(), world.today.getUTCMonth(), world.today.getUTCDate());

  await ensureColoniesNear(world, benchPear);
  // Tomorrow 13:00 UTC (early morning in the valley) on the pear block in bloom, no label data entered yet.
  const planned = await planSpray(ctx, applicator, sprayInput({
    blockIds: [benchPear.id], startsAt: new Date(dayStart + DAY + 13 * HOUR), hours: 3, productName: 'Quillfen 2EC (invented for the demo)', epaRegNo: '90001-11',
    activeIngredients: ['an invented organophosphate'], targetPest: 'Codling moth', applicatorName: world.users.applicator.name, notes: 'Ground rig, north to south',
  }));
  world.extra.sprays = { plannedId: planned.spray.id };

  const applied = await planSpray(ctx, applicator, sprayInput({
    blockIds: [benchGala.id], startsAt: new Date(dayStart - 4 * DAY + 4 * HOUR), hours: 2, productName: 'Marrowkelp Foliar (invented for the demo)', epaRegNo: '90001-12-90105',
    activeIngredients: ['kelp extract'], ld50UgPerBee: 100, rt25Hours: 2, targetPest: null, applicatorName: world.users.applicator.name,
  }));
  await applySpray(ctx, applicator, applied.spray.id, new Date(dayStart - 4 * DAY + 4.5 * HOUR));

  const cancelled = await planSpray(ctx, applicator, sprayInput({
    blockIds: [benchBraeburn.id], startsAt: new Date(dayStart + 6 * DAY + 5 * HOUR), hours: 2, productName: 'Tansybar 50WP (invented for the demo)', epaRegNo: '90002-7',
    ld50UgPerBee: 0.5, rt25Hours: 30, targetPest: 'Codling moth',
  }));
  await cancelSpray(ctx, applicator, cancelled.spray.id);
  Object.assign(world.extra.sprays as object, { appliedId: applied.spray.id, cancelledId: cancelled.spray.id });

  // Codling moth trap checks on the Gala block every three days; catches on two successive checks set the biofix.
  const counts = [0, 0, 1, 0, 2, 5, 7];
  for (const [i, moths] of counts.entries()) {
    await builderSequelize().query(
      `INSERT INTO pest_trap_counts (block_id, pest_model_id, checked_on, moths, recorded_by) VALUES (:blockId, 'codling-moth', :day, :moths, :by)`,
      { replacements: { blockId: benchGala.id, day: new Date(dayStart - (counts.length - i) * 3 * DAY).toISOString().slice(0, 10), moths, by: applicator.id } },
    );
  }
}
