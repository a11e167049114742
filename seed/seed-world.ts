// What the seed parts build and hand on to each other (later parts use earlier ones).
import type { Organization } from '../server/src/db/models/organization.model.js';
import type { User } from '../server/src/db/models/user.model.js';

export interface SeedWorld {
  /** The demo season's reference day: the seed is deterministic relative to it. */
  today: Date;
  organizations: Record<'farm' | 'farm2' | 'apiary' | 'apiary2', Organization>;
  users: Record<'grower' | 'applicator' | 'grower2' | 'keeper' | 'crew' | 'keeper2' | 'admin', User>;
  /** Free-form handles later parts add (blocks, requests, agreements ...). */
  extra: Record<string, unknown>;
}
