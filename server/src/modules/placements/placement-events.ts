// What the placements feature tells the spray conflict check when colonies' time on site
// may have changed (delivered, moved, picked up, an agreement confirmed or amended): called
// with the change's own transaction, it writes a durable re-check job for the placement's
// agreement that exists exactly when the change is committed.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import { agreementChanged } from '../alerts/conflict-rechecks.js';

export type PlacementChangeReason = 'scheduled' | 'delivered' | 'picked-up' | 'strength-checked' | 'disputed' | 'agreement-amended' | 'agreement-ended';

export async function placementChanged(ctx: AppContext, transaction: Transaction, placementId: string, _reason: PlacementChangeReason): Promise<void> {
  const placement = await ctx.models.Placement.findByPk(placementId, { attributes: ['agreementId'], transaction });
  if (placement) await agreementChanged(ctx, transaction, placement.agreementId);
}
