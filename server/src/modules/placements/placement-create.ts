// Placements for an agreement once both sides confirm it: its colonies are spread over
// the request's drop sites in order, each filled up to its planned colonies less what
// other agreements already place there; anything left goes to the last site. Until
// delivery a placement is expected on site for the agreement's window.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { TimeRange } from '../../db/time-range.js';

export async function createPlacementsForAgreement(ctx: AppContext, agreementId: string, t: Transaction): Promise<string[]> {
  const agreement = await ctx.models.Agreement.findByPk(agreementId, { attributes: ['id', 'requestId', 'colonies', 'expectedOnSite'], transaction: t, rejectOnEmpty: true });
  const sites = await ctx.models.DropSite.findAll({
    attributes: ['id', 'coloniesPlanned'],
    where: { requestId: agreement.requestId },
    include: [{
      model: ctx.models.Placement, as: 'placements', attributes: ['coloniesPlanned'], required: false,
      include: [{ model: ctx.models.Agreement, as: 'agreement', attributes: [], where: { state: ['in-force', 'completed'] } }],
    }],
    order: [['createdAt', 'ASC'], ['name', 'ASC'], ['id', 'ASC']],
    transaction: t,
  });
  const shares = new Map<string, number>();
  let left = agreement.colonies;
  for (const site of sites) {
    const taken = site.placements!.reduce((sum, p) => sum + p.coloniesPlanned, 0);
    const share = Math.min(left, Math.max(0, site.coloniesPlanned - taken));
    if (share > 0) shares.set(site.id, share);
    left -= share;
  }
  if (left > 0 && sites.length) shares.set(sites.at(-1)!.id, (shares.get(sites.at(-1)!.id) ?? 0) + left);
  const window: TimeRange = agreement.expectedOnSite;
  const created = await ctx.models.Placement.bulkCreate(
    [...shares].map(([dropSiteId, colonies]) => ({ agreementId, dropSiteId, state: 'scheduled' as const, coloniesPlanned: colonies, onSite: [{ ...window[0] }, { ...window[1] }] as TimeRange })),
    { transaction: t },
  );
  return created.map((p) => p.id);
}
