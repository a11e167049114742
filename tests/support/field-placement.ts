// The world the field browser tests start from: the demo accounts and one signed season
// whose placement is scheduled from tomorrow for three weeks, nothing dropped off yet.
import { seedAccounts } from '../../seed/parts/accounts.seed.js';
import type { SeedWorld } from '../../seed/seed-world.js';
import { buildSignedSeason } from './builders/season.js';

/** Returns the id of the scheduled placement of `colonies` colonies. */
export async function buildScheduledFieldPlacement(colonies: number): Promise<string> {
  const world = { today: new Date(), extra: {} } as SeedWorld;
  await seedAccounts(world);
  const now = Date.now();
  const season = await buildSignedSeason({
    farm: world.organizations.farm, apiary: world.organizations.apiary, colonies, delivered: false, minFramesOfBees: 6,
    onSite: { from: new Date(now + 86_400_000), to: new Date(now + 21 * 86_400_000) },
  });
  return season.placement.id;
}
