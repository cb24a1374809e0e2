import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory, createRouter, type Router } from 'vue-router';
import { routes } from '@/router/routes.ts';
import { installAuthGuard } from '@/router/guards.ts';
import { apiFetch, getToken, setToken } from '@/api/http.ts';
import { useAuthStore } from '@/stores/auth.ts';
import { mockFetch } from './fetchMock.ts';

const user = { id: 3, email: 'ana@example.test', name: 'Ana Example', isAdmin: false, emailVerified: true };

function makeRouter(): Router {
  setActivePinia(createPinia());
  const router = createRouter({ history: createMemoryHistory(), routes });
  installAuthGuard(router);
  return router;
}

describe('route guard and sign-out on 401', () => {
  beforeEach(() => localStorage.clear());
  afterEach(() => vi.unstubAllGlobals());

  it('sends a visitor who is not signed in to the sign-in page, remembering the page asked for', async () => {
    mockFetch({});
    const router = makeRouter();
    await router.push('/buildings/7');
    expect(router.currentRoute.value.name).toBe('sign-in');
    expect(router.currentRoute.value.query.redirect).toBe('/buildings/7');
  });

  it('sends the bare root to the sign-in page when signed out, and to the buildings list when signed in', async () => {
    mockFetch({ 'GET /api/me': () => ({ status: 200, body: user }) });
    const router = makeRouter();
    await router.push('/');
    expect(router.currentRoute.value.name).toBe('sign-in');
    setToken('tok-root');
    const signedIn = makeRouter();
    await signedIn.push('/');
    expect(signedIn.currentRoute.value.name).toBe('buildings');
  });

  it('lets a signed-in user through and loads who they are once', async () => {
    setToken('tok-1');
    const requests = mockFetch({ 'GET /api/me': () => ({ status: 200, body: user }) });
    const router = makeRouter();
    await router.push('/buildings');
    await router.push('/buildings/7');
    expect(router.currentRoute.value.name).toBe('building');
    expect(useAuthStore().user).toEqual(user);
    expect(requests.filter((r) => r.url === '/api/me')).toHaveLength(1);
    expect(requests[0].authorization).toBe('Bearer tok-1');
  });

  it('keeps a signed-in user away from the sign-in page', async () => {
    setToken('tok-1');
    mockFetch({ 'GET /api/me': () => ({ status: 200, body: user }) });
    const router = makeRouter();
    await router.push('/sign-in');
    expect(router.currentRoute.value.name).toBe('buildings');
  });

  it('signs out, forgets the token and leaves the page when any request answers 401', async () => {
    setToken('tok-1');
    mockFetch({
      'GET /api/me': () => ({ status: 200, body: user }),
      'GET /api/buildings': () => ({
        status: 401,
        body: { error: { code: 'unauthenticated', message: 'Your session has ended' } },
      }),
    });
    const router = makeRouter();
    await router.push('/buildings');
    await expect(apiFetch('GET', '/buildings')).rejects.toThrow('Your session has ended');
    await flushPromises();
    expect(getToken()).toBeNull();
    expect(useAuthStore().isSignedIn).toBe(false);
    expect(router.currentRoute.value.name).toBe('sign-in');
  });
});
