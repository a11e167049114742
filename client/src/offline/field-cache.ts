// The reads a crew member needs without signal: the session, the drop-site list and each
// drop-off and pickup due in the next 7 days (position, gate notes, the agreement's
// minimum strength). Asking for them while online lets the service worker keep the
// answers (cache "field-reads", see vite.config.ts); the pages then open offline.
import { authApi } from '@/api/auth';
import { placementsApi } from '@/api/placements';
import type { PlacementDto } from '@shared/schemas/placements';

export const fieldWeekDays = 7;
const fieldCaches = ['field-reads', 'field-photos'];

/** Drop-offs starting within the next days, and every placement on site (its pickup may come any day). */
export function dueWithin(placements: PlacementDto[], now: Date, days = fieldWeekDays): PlacementDto[] {
  const until = now.getTime() + days * 86_400_000;
  return placements.filter((p) =>
    p.state === 'delivered' || (p.state === 'scheduled' && (p.onSite.from == null || Date.parse(p.onSite.from) <= until)));
}

export async function warmFieldReads(): Promise<void> {
  if (!navigator.onLine || !navigator.serviceWorker?.controller) return;
  await authApi.csrf();
  await authApi.me();
  const { placements } = await placementsApi.list();
  await Promise.all(dueWithin(placements, new Date()).map((p) => placementsApi.get(p.id)));
}

/** On sign-out: what one crew member's phone kept is not for the next one. */
export async function forgetFieldReads(): Promise<void> {
  if (!('caches' in window)) return;
  await Promise.all(fieldCaches.map((name) => caches.delete(name)));
}
