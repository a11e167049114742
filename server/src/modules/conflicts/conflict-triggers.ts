// Re-runs the spray conflict check when what it reads changes elsewhere: a placement or
// agreement (through the placements hook), or a block's bloom window (bloomWindowChanged,
// called by the blocks feature after it stores a new window).
import { QueryTypes } from 'sequelize';
import type { AppContext } from '../../context.js';
import { onPlacementChanged } from '../placements/placement-events.js';
import { recheckSpraysForAgreement, recheckSpraysOnBlocks } from '../alerts/alert-recheck.js';

let subscribed = false;

/** Subscribes once per process; the listener gets each app's own context. */
export function subscribeConflictTriggers() {
  if (subscribed) return;
  subscribed = true;
  onPlacementChanged(async (ctx, placementId) => {
    const [row] = await ctx.sequelize.query<{ agreement_id: string }>('SELECT agreement_id FROM placements WHERE id = :placementId', {
      replacements: { placementId }, type: QueryTypes.SELECT,
    });
    if (row) await recheckSpraysForAgreement(ctx, row.agreement_id);
  });
}

/** Call after a block's bloom window is stored or revised. */
export async function bloomWindowChanged(ctx: AppContext, blockId: string): Promise<void> {
  try {
    await recheckSpraysOnBlocks(ctx, [blockId]);
  } catch (err) {
    ctx.logger.error({ err, blockId }, 'spray re-check after a bloom change failed');
  }
}

/** Call after an agreement's window or state changes without a placement (e.g. signed). */
export async function agreementChanged(ctx: AppContext, agreementId: string): Promise<void> {
  try {
    await recheckSpraysForAgreement(ctx, agreementId);
  } catch (err) {
    ctx.logger.error({ err, agreementId }, 'spray re-check after an agreement change failed');
  }
}
