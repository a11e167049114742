// A small world where a spray on one block conflicts with placed colonies during bloom: a
// farm and an apiary business (an owner each, who receive alert e-mails), colonies on the
// block, and a night start for sprays. Used by the realtime and fault tests.
import { buildOrganization, buildUser } from './builders/accounts.js';
import { buildSignedSeason } from './builders/season.js';
import { sprayInput } from './builders/sprays.js';

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const isoDay = (d: Date) => d.toISOString().slice(0, 10);

export interface AlertWorld {
  growerEmail: string;
  keeperEmail: string;
  farmId: string;
  apiaryId: string;
  blockId: string;
  /** A conflicting spray input, n days after the first night start, with its own product name. */
  conflictingSpray(n: number, productName?: string): ReturnType<typeof sprayInput>;
}

export async function buildAlertWorld(tag: string): Promise<AlertWorld> {
  const now = new Date();
  const farm = await buildOrganization({ kind: 'farm', name: `Hazelrun Orchard ${tag}` });
  const apiary = await buildOrganization({ kind: 'apiary', name: `Dunmoth Apiaries ${tag}` });
  const growerEmail = `grower@${tag}.test`;
  const keeperEmail = `keeper@${tag}.test`;
  await buildUser({ organization: farm, role: 'owner', email: growerEmail });
  await buildUser({ organization: apiary, role: 'owner', email: keeperEmail });
  const season = await buildSignedSeason({
    farm, apiary, colonies: 24, onSite: { from: new Date(now.getTime() - DAY), to: new Date(now.getTime() + 30 * DAY) },
    bloom: { bloomStart: isoDay(new Date(now.getTime() - 2 * DAY)), petalFall: isoDay(new Date(now.getTime() + 20 * DAY)) },
  });
  // Night (outside bee flight at the block) four days out.
  const nightStart = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() + 4, 8));
  return {
    growerEmail, keeperEmail, farmId: farm.id, apiaryId: apiary.id, blockId: season.block.id,
    conflictingSpray: (n, productName) => sprayInput({ blockIds: [season.block.id], startsAt: new Date(nightStart.getTime() + n * DAY), ...(productName ? { productName } : {}) }),
  };
}
