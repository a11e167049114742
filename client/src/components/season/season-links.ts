// Where a timeline, map or dashboard item opens: the first of its candidate pages that the
// app has and the signed-in user's side and role may open. An item with none opens in place.
import type { Router, RouteLocationRaw } from 'vue-router';
import type { TimelineItem } from '@shared/schemas/dashboard';
import type { RouteMeta } from 'vue-router';
import { can } from '@shared/policies/index';
import { useSessionStore } from '@/stores/session';
import { routeTo, type RouteName } from '@/router/routes';

const candidates: Record<TimelineItem['kind'] | 'block' | 'placement-field', RouteName[]> = {
  bloom: ['block'],
  block: ['block'],
  placement: ['agreement'],
  'placement-field': ['placement', 'agreement'],
  spray: ['spray'],
  alert: ['alert', 'alerts'],
};

export function pageFor(router: Router, kind: keyof typeof candidates, id: string): RouteLocationRaw | null {
  for (const name of candidates[kind]) {
    if (!router.hasRoute(name)) continue;
    const target = router.resolve(routeTo(name, { id }));
    if (!mayOpen(target.meta)) continue;
    return target.matched.at(-1)?.path.includes(':id') ? routeTo(name, { id }) : routeTo(name);
  }
  return null;
}

export function itemLocation(router: Router, item: TimelineItem, blockId: string): RouteLocationRaw | null {
  return pageFor(router, item.kind, item.kind === 'bloom' ? blockId : (item.openId ?? item.id));
}

export function blockLocation(router: Router, blockId: string): RouteLocationRaw | null {
  return pageFor(router, 'block', blockId);
}

/** A page without an id (a list, a "new" form), when the user may open it. */
export function routeIfAllowed(router: Router, name: RouteName): RouteLocationRaw | null {
  if (!router.hasRoute(name)) return null;
  return mayOpen(router.resolve(routeTo(name)).meta) ? routeTo(name) : null;
}

/** The router guard's rule: the user's side and the route's policy action. */
function mayOpen(meta: RouteMeta): boolean {
  const session = useSessionStore();
  if (meta.sides && (!session.side || !meta.sides.includes(session.side))) return false;
  return !meta.can || can(session.roleKey, meta.can);
}
