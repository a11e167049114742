// Where a timeline or map item opens: the first of its candidate pages the app has. Each
// feature names its own detail pages; an item whose page does not exist opens in place.
import type { Router, RouteLocationRaw } from 'vue-router';
import type { TimelineItem } from '@shared/schemas/dashboard';

const candidates: Record<TimelineItem['kind'], string[]> = {
  bloom: ['block-detail', 'blocks'],
  placement: ['agreement-detail', 'placement-detail', 'agreements'],
  spray: ['spray-detail', 'sprays'],
  alert: ['alert-detail', 'alerts'],
};

export function itemLocation(router: Router, item: TimelineItem, blockId: string): RouteLocationRaw | null {
  const id = item.kind === 'bloom' ? blockId : (item.openId ?? item.id);
  for (const name of candidates[item.kind]) {
    if (!router.hasRoute(name)) continue;
    const needsId = router.resolve({ name, params: { id } }).matched.at(-1)?.path.includes(':id');
    return needsId ? { name, params: { id } } : { name };
  }
  return null;
}

export function blockLocation(router: Router, blockId: string): RouteLocationRaw | null {
  return router.hasRoute('block-detail') ? { name: 'block-detail', params: { id: blockId } } : router.hasRoute('blocks') ? { name: 'blocks' } : null;
}
