import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia, type Pinia } from 'pinia';
import { createMemoryHistory, createRouter, RouterView, type Router } from 'vue-router';
import { defineComponent, h } from 'vue';
import { routes } from '@/router/routes.ts';
import { installAuthGuard } from '@/router/guards.ts';
import { setToken } from '@/api/http.ts';
import { mockFetch } from './fetchMock.ts';

// Invented accounts.
const admin = { id: 1, email: 'admin@example.test', name: 'Site Admin', isAdmin: true, emailVerified: true };
const engineer = { id: 3, email: 'ana@example.test', name: 'Ana Example', isAdmin: false, emailVerified: true };

let pinia: Pinia;
function makeRouter(): Router {
  pinia = createPinia();
  setActivePinia(pinia);
  const router = createRouter({ history: createMemoryHistory(), routes });
  installAuthGuard(router);
  return router;
}

async function mountApp(router: Router) {
  const App = defineComponent(() => () => h(RouterView));
  const wrapper = mount(App, { attachTo: document.body, global: { plugins: [pinia, router] } });
  await flushPromises();
  return wrapper;
}

describe('the outbox route and menu entry', () => {
  beforeEach(() => {
    localStorage.clear();
    setToken('tok-1');
  });
  afterEach(() => {
    vi.unstubAllGlobals();
    document.body.innerHTML = '';
  });

  it('sends a signed-in user who is not a site admin to the buildings list, without asking for the outbox', async () => {
    const requests = mockFetch({
      'GET /api/me': () => ({ status: 200, body: engineer }),
      'GET /api/buildings': () => ({ status: 200, body: [] }),
    });
    const router = makeRouter();
    await router.push('/outbox');
    expect(router.currentRoute.value.name).toBe('buildings');
    const wrapper = await mountApp(router);
    expect(wrapper.find('[data-test="nav-outbox"]').exists()).toBe(false);
    expect(requests.some((r) => r.url.startsWith('/api/dev/'))).toBe(false);
    wrapper.unmount();
  });

  it('sends a visitor who is not signed in to sign in first', async () => {
    setToken(null);
    mockFetch({});
    const router = makeRouter();
    await router.push('/outbox');
    expect(router.currentRoute.value.name).toBe('sign-in');
    expect(router.currentRoute.value.query.redirect).toBe('/outbox');
  });

  it('lets a site admin in, with an Outbox entry in the main menu, and shows the captured e-mails', async () => {
    mockFetch({
      'GET /api/me': () => ({ status: 200, body: admin }),
      'GET /api/dev/outbox': () => ({
        status: 200,
        body: [
          {
            id: 9,
            to: 'ana@example.test',
            subject: 'Welcome to Stanchion',
            text: 'Hello',
            html: null,
            attachments: [],
            createdAt: '2026-03-14T09:05:00.000Z',
          },
        ],
      }),
    });
    const router = makeRouter();
    await router.push('/outbox');
    expect(router.currentRoute.value.name).toBe('outbox');
    const wrapper = await mountApp(router);
    expect(wrapper.find('[data-test="nav-outbox"]').text()).toContain('Outbox');
    expect(wrapper.find('[data-test="outbox-row"]').text()).toContain('Welcome to Stanchion');
    wrapper.unmount();
  });
});
