// An in-process hook for code that must react when colonies' time on site may have
// changed: a placement's field step, an agreement confirmed or amended. The spray
// conflict check subscribes here to re-run. Listeners run after the change is stored;
// one that fails is logged and does not undo the change.
import type { AppContext } from '../../context.js';

export type PlacementChangeReason = 'scheduled' | 'delivered' | 'picked-up' | 'strength-checked' | 'disputed' | 'agreement-amended' | 'agreement-ended';
export type PlacementListener = (ctx: AppContext, placementId: string, reason: PlacementChangeReason) => void | Promise<void>;

const listeners = new Set<PlacementListener>();

/** Subscribes; returns a function that unsubscribes. */
export function onPlacementChanged(listener: PlacementListener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export async function placementChanged(ctx: AppContext, placementId: string, reason: PlacementChangeReason): Promise<void> {
  for (const listener of [...listeners]) {
    try {
      await listener(ctx, placementId, reason);
    } catch (err) {
      ctx.logger.error({ err, placementId, reason }, 'placement listener failed');
    }
  }
}
