import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory, createRouter, type Router } from 'vue-router';
import { defineComponent, h } from 'vue';
import SignInPage from '@/pages/SignInPage.vue';
import { getToken } from '@/api/http.ts';
import { mockFetch } from './fetchMock.ts';

const Stub = defineComponent(() => () => h('div'));

async function mountSignIn(redirect?: string): Promise<{ wrapper: ReturnType<typeof mount>; router: Router }> {
  const pinia = createPinia();
  setActivePinia(pinia);
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/sign-in', name: 'sign-in', component: SignInPage },
      { path: '/register', name: 'register', component: Stub },
      { path: '/buildings', name: 'buildings', component: Stub },
      { path: '/buildings/:id', name: 'building', component: Stub },
    ],
  });
  await router.push({ name: 'sign-in', query: redirect ? { redirect } : {} });
  await router.isReady();
  const wrapper = mount(SignInPage, { global: { plugins: [pinia, router] } });
  return { wrapper, router };
}

async function fillAndSubmit(wrapper: ReturnType<typeof mount>, email: string, password: string): Promise<void> {
  await wrapper.find('input[data-test="email"]').setValue(email);
  await wrapper.find('input[data-test="password"]').setValue(password);
  await wrapper.find('form').trigger('submit');
  await flushPromises();
}

const user = { id: 3, email: 'ana@example.test', name: 'Ana Example', isAdmin: false, emailVerified: true };

describe('sign-in form', () => {
  beforeEach(() => localStorage.clear());
  afterEach(() => vi.unstubAllGlobals());

  it('refuses an address that is not an e-mail and an empty password, with a message, without calling the server', async () => {
    const requests = mockFetch({});
    const { wrapper } = await mountSignIn();
    await fillAndSubmit(wrapper, 'not-an-address', '');
    expect(wrapper.text()).toContain('E-mail must be an e-mail address');
    expect(wrapper.text()).toContain('Password is required');
    expect(requests).toHaveLength(0);
  });

  it('asks for an e-mail address left empty rather than calling it a wrong one', async () => {
    const requests = mockFetch({});
    const { wrapper } = await mountSignIn();
    await fillAndSubmit(wrapper, '  ', 'secret-enough');
    expect(wrapper.text()).toContain('E-mail is required');
    expect(wrapper.text()).not.toContain('must be an e-mail address');
    expect(requests).toHaveLength(0);
  });

  it('sends the trimmed, lower-cased address, keeps the token and goes to the page that was asked for', async () => {
    const requests = mockFetch({ 'POST /api/auth/login': () => ({ status: 200, body: { token: 'tok-123', user } }) });
    const { wrapper, router } = await mountSignIn('/buildings/7');
    await fillAndSubmit(wrapper, '  Ana@Example.TEST ', 'correct horse');
    expect(requests).toEqual([
      {
        method: 'POST',
        url: '/api/auth/login',
        body: { email: 'ana@example.test', password: 'correct horse' },
        authorization: null,
      },
    ]);
    expect(getToken()).toBe('tok-123');
    expect(router.currentRoute.value.fullPath).toBe('/buildings/7');
  });

  it('ignores a redirect that would leave the site and goes to the buildings list', async () => {
    mockFetch({ 'POST /api/auth/login': () => ({ status: 200, body: { token: 'tok-123', user } }) });
    const { wrapper, router } = await mountSignIn('//elsewhere.example/steal');
    await fillAndSubmit(wrapper, 'ana@example.test', 'correct horse');
    expect(router.currentRoute.value.name).toBe('buildings');
  });

  it("shows the server's message and stays on the page when the password is wrong", async () => {
    mockFetch({
      'POST /api/auth/login': () => ({
        status: 401,
        body: { error: { code: 'unauthenticated', message: 'E-mail or password is wrong' } },
      }),
    });
    const { wrapper, router } = await mountSignIn();
    await fillAndSubmit(wrapper, 'ana@example.test', 'wrong password');
    expect(wrapper.find('[data-test="failure"]').text()).toBe('E-mail or password is wrong');
    expect(router.currentRoute.value.name).toBe('sign-in');
    expect(getToken()).toBeNull();
  });
});
