// The router and its guards: signed-out users go to sign-in (and come back after); a
// signed-in user opening sign-in or sign-up goes home; a page outside the user's side or
// role sends them home. A 401 from any API call ends the session here and goes to
// sign-in, with the page to come back to.
import { createRouter, createWebHistory } from 'vue-router';
import { routes, type RouteName } from './routes';
import { can } from '@shared/policies/index';
import { useSessionStore } from '@/stores/session';
import { pinia } from '@/plugins/pinia';
import { setUnauthenticatedHandler } from '@/api/http';
import { safeRedirect } from '@/composables/useAuthLinks';

export const router = createRouter({ history: createWebHistory(), routes });

const signedOutOnly: RouteName[] = ['sign-in', 'sign-up', 'forgot-password'];

router.beforeEach(async (to) => {
  const session = useSessionStore(pinia);
  await session.load();
  if (to.meta.public) {
    if (session.user && signedOutOnly.includes(to.name as RouteName)) return safeRedirect(to.query.redirect);
    return true;
  }
  if (!session.user) return { name: 'sign-in', query: { redirect: to.fullPath } };
  if (to.meta.sides && !to.meta.sides.includes(session.side!)) return { name: 'home' };
  if (to.meta.can && !can(session.roleKey, to.meta.can)) return { name: 'home' };
  return true;
});

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Pollenpact` : 'Pollenpact';
});

setUnauthenticatedHandler(() => {
  const session = useSessionStore(pinia);
  session.forget();
  const current = router.currentRoute.value;
  if (!current.meta.public) void router.push({ name: 'sign-in', query: { redirect: current.fullPath } });
});
