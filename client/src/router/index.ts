// The router and its guards: signed-out users go to sign-in (and come back after);
// a page outside the user's side or role sends them home.
import { createRouter, createWebHistory } from 'vue-router';
import { routes } from './routes';
import { useSessionStore } from '@/stores/session';
import { pinia } from '@/plugins/pinia';
import { setUnauthenticatedHandler } from '@/api/http';

export const router = createRouter({ history: createWebHistory(), routes });

router.beforeEach(async (to) => {
  const session = useSessionStore(pinia);
  await session.load();
  if (to.meta.public) return true;
  if (!session.user) return { name: 'sign-in', query: { redirect: to.fullPath } };
  if (to.meta.sides && !to.meta.sides.includes(session.side!)) return { name: 'home' };
  if (to.meta.roles && !to.meta.roles.includes(session.roleKey!)) return { name: 'home' };
  return true;
});

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Pollenpact` : 'Pollenpact';
});

setUnauthenticatedHandler(() => {
  const session = useSessionStore(pinia);
  session.forget();
  const current = router.currentRoute.value;
  if (!current.meta.public) router.push({ name: 'sign-in', query: { redirect: current.fullPath } });
});
