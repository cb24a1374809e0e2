// Every page is its own chunk (route-level code splitting) so the first download stays small.
import type { RouteLocationRaw, RouteRecordRaw } from 'vue-router';
import { useAuthStore } from '@/stores/auth.ts';

declare module 'vue-router' {
  interface RouteMeta {
    /** Reachable without signing in. */
    public?: boolean;
    /** Only for visitors who are not signed in (sign-in, register). */
    guestOnly?: boolean;
  }
}

/** Site admins only; anyone else goes to the buildings list. The global guard has loaded the user by now. */
function adminOnly(): true | RouteLocationRaw {
  return useAuthStore().user?.isAdmin ? true : { name: 'buildings' };
}

export const routes: RouteRecordRaw[] = [
  {
    path: '/',
    component: () => import('@/layouts/AuthLayout.vue'),
    meta: { public: true, guestOnly: true },
    children: [
      // The bare root matched this layout with no page in it (a blank screen when signed out): it is the
      // sign-in page, which sends a signed-in person on to the buildings list.
      { path: '', redirect: { name: 'sign-in' } },
      {
        path: 'sign-in',
        name: 'sign-in',
        component: () => import('@/pages/SignInPage.vue'),
        meta: { public: true, guestOnly: true },
      },
      {
        path: 'register',
        name: 'register',
        component: () => import('@/pages/RegisterPage.vue'),
        meta: { public: true, guestOnly: true },
      },
    ],
  },
  {
    // The link in the verification e-mail: opened signed in or not.
    path: '/verify-email',
    component: () => import('@/layouts/AuthLayout.vue'),
    meta: { public: true },
    children: [
      {
        path: '',
        name: 'verify-email',
        component: () => import('@/pages/VerifyEmailPage.vue'),
        meta: { public: true },
      },
    ],
  },
  {
    path: '/',
    component: () => import('@/layouts/MainLayout.vue'),
    children: [
      { path: '', redirect: { name: 'buildings' } },
      { path: 'buildings', name: 'buildings', component: () => import('@/pages/BuildingsPage.vue') },
      { path: 'buildings/:id', name: 'building', component: () => import('@/pages/BuildingPage.vue') },
      { path: 'buildings/:id/revisions', name: 'revisions', component: () => import('@/pages/RevisionsPage.vue') },
      { path: 'buildings/:id/plan', name: 'plan', component: () => import('@/pages/PlanPage.vue') },
      { path: 'buildings/:id/schedule', name: 'schedule', component: () => import('@/pages/SchedulePage.vue') },
      { path: '/stacks/:id', name: 'stack', component: () => import('@/pages/StackPage.vue') },
      { path: 'outbox', name: 'outbox', component: () => import('@/pages/OutboxPage.vue'), beforeEnter: adminOnly },
    ],
  },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('@/pages/NotFoundPage.vue'),
    meta: { public: true },
  },
];
