// The demo scenario, in order. Each part adds to the world the next ones build on.
// Features add their part to the list.
import type { SeedWorld } from './seed-world.js';
import { seedAccounts } from './parts/accounts.seed.js';
import { seedBlocks } from './parts/blocks.seed.js';
import { seedRequests } from './parts/requests.seed.js';
import { seedSprays } from './parts/sprays.seed.js';
import { seedInvoices } from './parts/invoices.seed.js';

export const seedParts: Array<{ name: string; run: (world: SeedWorld) => Promise<void> }> = [
  { name: 'accounts', run: seedAccounts },
  { name: 'blocks', run: seedBlocks },
  { name: 'requests', run: seedRequests },
  { name: 'sprays', run: seedSprays },
  { name: 'invoices', run: seedInvoices },
];

export async function seedScenario(today: Date): Promise<SeedWorld> {
  const world = { today, extra: {} } as SeedWorld;
  for (const part of seedParts) await part.run(world);
  return world;
}
