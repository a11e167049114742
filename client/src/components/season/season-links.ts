// Where a timeline, map or dashboard item opens: the first of its candidate pages that the
// app has and the signed-in user's side and role may open. An item with none opens in place.
import type { Router, RouteLocationRaw } from 'vue-router';
import type { TimelineItem } from '@shared/schemas/dashboard';
import type { RoleKey } from '@shared/roles';
import { useSessionStore } from '@/stores/session';

const candidates: Record<TimelineItem['kind'] | 'block' | 'placement-field', string[]> = {
  bloom: ['block'],
  block: ['block'],
  placement: ['agreement'],
  'placement-field': ['placement', 'agreement'],
  spray: ['spray'],
  alert: ['alert', 'alerts'],
};

export function pageFor(router: Router, kind: keyof typeof candidates, id: string): RouteLocationRaw | null {
  const session = useSessionStore();
  for (const name of candidates[kind]) {
    if (!router.hasRoute(name)) continue;
    const target = router.resolve({ name, params: { id } });
    const meta = target.meta;
    if (meta.sides && (!session.side || !meta.sides.includes(session.side))) continue;
    if (meta.roles && (!session.roleKey || !meta.roles.includes(session.roleKey as RoleKey))) continue;
    return target.matched.at(-1)?.path.includes(':id') ? { name, params: { id } } : { name };
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
export function routeIfAllowed(router: Router, name: string): RouteLocationRaw | null {
  if (!router.hasRoute(name)) return null;
  const session = useSessionStore();
  const meta = router.resolve({ name }).meta;
  if (meta.sides && (!session.side || !meta.sides.includes(session.side))) return null;
  if (meta.roles && (!session.roleKey || !meta.roles.includes(session.roleKey as RoleKey))) return null;
  return { name };
}
