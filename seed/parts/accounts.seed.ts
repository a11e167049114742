// The demo's organizations and people: two farms and two apiary businesses in an invented
// valley, and the platform admin. Every demo account uses the password pollen-demo-2026.
import { buildOrganization, buildUser } from '../../tests/support/builders/accounts.js';
import type { SeedWorld } from '../seed-world.js';

export async function seedAccounts(world: SeedWorld) {
  const farm = await buildOrganization({ kind: 'farm', name: 'Larkspur Bench Orchards', billingEmail: 'grower@orchard.test' });
  const farm2 = await buildOrganization({ kind: 'farm', name: 'Cinder Ridge Fruit Co.', billingEmail: 'grower2@ridge.test' });
  const apiary = await buildOrganization({ kind: 'apiary', name: 'Fernhollow Apiaries', coloniesOwned: 1200, billingEmail: 'keeper@apiary.test' });
  const apiary2 = await buildOrganization({ kind: 'apiary', name: 'Brightcomb Hive Works', coloniesOwned: 450, billingEmail: 'keeper2@hives.test' });
  world.organizations = { farm, farm2, apiary, apiary2 };
  world.users = {
    grower: await buildUser({ organization: farm, role: 'owner', email: 'grower@orchard.test', name: 'Ada Fenwright' }),
    applicator: await buildUser({ organization: farm, role: 'applicator', email: 'applicator@orchard.test', name: 'Milo Quarrend' }),
    grower2: await buildUser({ organization: farm2, role: 'owner', email: 'grower2@ridge.test', name: 'Ines Harrowgate' }),
    keeper: await buildUser({ organization: apiary, role: 'owner', email: 'keeper@apiary.test', name: 'Tobin Waxley' }),
    crew: await buildUser({ organization: apiary, role: 'crew', email: 'crew@apiary.test', name: 'Rosa Linden-Marsh' }),
    keeper2: await buildUser({ organization: apiary2, role: 'owner', email: 'keeper2@hives.test', name: 'Oren Castellby' }),
    admin: await buildUser({ organization: null, role: 'admin', email: 'admin@pollenpact.test', name: 'Platform Admin' }),
  };
}
