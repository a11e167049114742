// Every client route, lazy-loaded. Features add theirs to the list and their name to RouteName.
import type { RouteRecordRaw } from 'vue-router';
import type { RoleKey } from '@shared/roles';

export type Side = 'farm' | 'apiary' | 'admin';

export type RouteName =
  | 'sign-in'
  | 'home'
  | 'not-found';

declare module 'vue-router' {
  interface RouteMeta {
    /** Reachable signed out (sign-in, sign-up, reset ...). */
    public?: boolean;
    /** Which sides may open it; all signed-in users when absent. */
    sides?: Side[];
    /** Narrower: the roles that may open it. */
    roles?: RoleKey[];
    title?: string;
  }
}

export const authRoutes: RouteRecordRaw[] = [
  { path: '/sign-in', name: 'sign-in', component: () => import('@/pages/auth/SignInPage.vue'), meta: { public: true, title: 'Sign in' } },
];

/** Pages inside the signed-in layout. */
export const appRoutes: RouteRecordRaw[] = [
  { path: '', name: 'home', component: () => import('@/pages/HomePage.vue'), meta: { title: 'Season overview' } },
];

export const routes: RouteRecordRaw[] = [
  ...authRoutes,
  { path: '/', component: () => import('@/layouts/AppLayout.vue'), children: appRoutes },
  { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('@/pages/NotFoundPage.vue'), meta: { public: true, title: 'Not found' } },
];
