// Every client route, lazy-loaded. Features add theirs to the list and their name to RouteName.
import type { RouteLocationRaw, RouteParamsGeneric, RouteParamsRawGeneric, RouteRecordInfo, RouteRecordRaw } from 'vue-router';
import type { PolicyAction } from '@shared/policies/index';

export type Side = 'farm' | 'apiary' | 'admin';

export type RouteName =
  | 'sign-in'
  | 'sign-up'
  | 'forgot-password'
  | 'reset-password'
  | 'invitation'
  | 'members'
  | 'home'
  | 'season-timeline'
  | 'season-map'
  | 'blocks'
  | 'block-new'
  | 'block'
  | 'block-edit'
  | 'stage-thresholds'
  | 'weather-stations'
  | 'weather-station'
  | 'sprays'
  | 'spray-new'
  | 'spray'
  | 'spray-edit'
  | 'alerts'
  | 'alert'
  | 'invoices'
  | 'invoice'
  | 'requests'
  | 'request-new'
  | 'request'
  | 'yards'
  | 'agreements'
  | 'agreement'
  | 'placements'
  | 'placement'
  | 'not-found';

/** Typed route names: `router.push({ name: 'sprai' })` or a `<RouterLink :to="{ name: 'sprai' }">` fails the type check. */
export type RouteNamedMap = { [N in RouteName]: RouteRecordInfo<N, string, RouteParamsRawGeneric, RouteParamsGeneric> };

declare module 'vue-router' {
  interface TypesConfig {
    RouteNamedMap: RouteNamedMap;
  }
  interface RouteMeta {
    /** Reachable signed out (sign-in, sign-up, reset ...). */
    public?: boolean;
    /** Which sides may open it; all signed-in users when absent. */
    sides?: Side[];
    /** Narrower: the policy action (shared/policies) a role needs to open it. */
    can?: PolicyAction;
    title?: string;
  }
}

export const authRoutes: RouteRecordRaw[] = [
  { path: '/sign-in', name: 'sign-in', component: () => import('@/pages/auth/SignInPage.vue'), meta: { public: true, title: 'Sign in' } },
  { path: '/sign-up', name: 'sign-up', component: () => import('@/pages/auth/SignUpPage.vue'), meta: { public: true, title: 'Create an account' } },
  { path: '/forgot-password', name: 'forgot-password', component: () => import('@/pages/auth/ForgotPasswordPage.vue'), meta: { public: true, title: 'Reset your password' } },
  { path: '/reset-password', name: 'reset-password', component: () => import('@/pages/auth/ResetPasswordPage.vue'), meta: { public: true, title: 'Choose a new password' } },
  { path: '/invitation', name: 'invitation', component: () => import('@/pages/auth/AcceptInvitationPage.vue'), meta: { public: true, title: 'Join your team' } },
];

/** Pages inside the signed-in layout. */
export const appRoutes: RouteRecordRaw[] = [
  { path: '', name: 'home', component: () => import('@/pages/HomePage.vue'), meta: { title: 'Season overview' } },
  { path: 'blocks', name: 'blocks', component: () => import('@/pages/blocks/BlockListPage.vue'), meta: { title: 'Blocks', sides: ['farm'] } },
  { path: 'blocks/new', name: 'block-new', component: () => import('@/pages/blocks/BlockEditPage.vue'), meta: { title: 'New block', sides: ['farm'], can: 'blocks.create' } },
  { path: 'blocks/:id', name: 'block', component: () => import('@/pages/blocks/BlockDetailPage.vue'), meta: { title: 'Block', sides: ['farm'] } },
  { path: 'blocks/:id/edit', name: 'block-edit', component: () => import('@/pages/blocks/BlockEditPage.vue'), meta: { title: 'Change block', sides: ['farm'], can: 'blocks.update' } },
  { path: 'bloom/thresholds', name: 'stage-thresholds', component: () => import('@/pages/blocks/StageThresholdsPage.vue'), meta: { title: 'Stage thresholds', sides: ['farm', 'admin'] } },
  { path: 'weather', name: 'weather-stations', component: () => import('@/pages/weather/StationListPage.vue'), meta: { title: 'Weather stations', sides: ['farm'] } },
  { path: 'weather/:id', name: 'weather-station', component: () => import('@/pages/weather/StationDetailPage.vue'), meta: { title: 'Weather station', sides: ['farm'] } },
  { path: 'organization/members', name: 'members', component: () => import('@/pages/organization/MembersPage.vue'), meta: { title: 'Members', sides: ['farm', 'apiary'], can: 'organization.invite' } },
  { path: 'season/timeline', name: 'season-timeline', component: () => import('@/pages/season/SeasonTimelinePage.vue'), meta: { title: 'Season timeline', sides: ['farm', 'apiary'] } },
  { path: 'season/map', name: 'season-map', component: () => import('@/pages/season/SeasonMapPage.vue'), meta: { title: 'Season map', sides: ['farm', 'apiary'] } },
  { path: 'sprays', name: 'sprays', component: () => import('@/pages/sprays/SprayListPage.vue'), meta: { title: 'Sprays', sides: ['farm'] } },
  { path: 'sprays/new', name: 'spray-new', component: () => import('@/pages/sprays/SprayEditPage.vue'), meta: { title: 'Plan a spray', sides: ['farm'], can: 'sprays.plan' } },
  { path: 'sprays/:id', name: 'spray', component: () => import('@/pages/sprays/SprayDetailPage.vue'), meta: { title: 'Spray plan', sides: ['farm'] } },
  { path: 'sprays/:id/edit', name: 'spray-edit', component: () => import('@/pages/sprays/SprayEditPage.vue'), meta: { title: 'Change the spray plan', sides: ['farm'], can: 'sprays.plan' } },
  { path: 'alerts', name: 'alerts', component: () => import('@/pages/alerts/AlertListPage.vue'), meta: { title: 'Spray alerts', sides: ['farm', 'apiary'] } },
  { path: 'alerts/:id', name: 'alert', component: () => import('@/pages/alerts/AlertListPage.vue'), meta: { title: 'Spray alert', sides: ['farm', 'apiary'] } },
  { path: 'invoices', name: 'invoices', component: () => import('@/pages/invoices/InvoiceListPage.vue'), meta: { title: 'Invoices', sides: ['farm', 'apiary'], can: 'invoices.read' } },
  { path: 'invoices/:id', name: 'invoice', component: () => import('@/pages/invoices/InvoiceDetailPage.vue'), meta: { title: 'Invoice', sides: ['farm', 'apiary'], can: 'invoices.read' } },
  { path: 'requests', name: 'requests', component: () => import('@/pages/requests/RequestListPage.vue'), meta: { title: 'Hive requests', sides: ['farm', 'apiary'] } },
  { path: 'requests/new', name: 'request-new', component: () => import('@/pages/requests/RequestFormPage.vue'), meta: { title: 'New hive request', sides: ['farm'], can: 'requests.manage' } },
  { path: 'requests/:id', name: 'request', component: () => import('@/pages/requests/RequestDetailPage.vue'), meta: { title: 'Hive request', sides: ['farm', 'apiary'] } },
  { path: 'yards', name: 'yards', component: () => import('@/pages/requests/YardListPage.vue'), meta: { title: 'Yards', sides: ['apiary'] } },
  { path: 'agreements', name: 'agreements', component: () => import('@/pages/agreements/AgreementListPage.vue'), meta: { title: 'Agreements', sides: ['farm', 'apiary'] } },
  { path: 'agreements/:id', name: 'agreement', component: () => import('@/pages/agreements/AgreementDetailPage.vue'), meta: { title: 'Agreement', sides: ['farm', 'apiary'] } },
  { path: 'placements', name: 'placements', component: () => import('@/pages/placements/PlacementListPage.vue'), meta: { title: 'Placements', sides: ['farm', 'apiary'] } },
  { path: 'placements/:id', name: 'placement', component: () => import('@/pages/placements/PlacementFieldPage.vue'), meta: { title: 'Placement', sides: ['farm', 'apiary'] } },
];

export const routes: RouteRecordRaw[] = [
  ...authRoutes,
  { path: '/', component: () => import('@/layouts/AppLayout.vue'), children: appRoutes },
  { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('@/pages/NotFoundPage.vue'), meta: { public: true, title: 'Not found' } },
];

/** A location from a name held in a variable (a union of names the typed map cannot spread over). */
export function routeTo(name: RouteName, params?: Record<string, string>): RouteLocationRaw {
  return (params ? { name, params } : { name }) as RouteLocationRaw;
}
