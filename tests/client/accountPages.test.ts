// Registration starts no session and says a link is on its way; the verification page follows the link;
// signing out asks the server to end every session (docs/access.md).
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory, createRouter } from 'vue-router';
import { defineComponent, h } from 'vue';
import RegisterPage from '@/pages/RegisterPage.vue';
import VerifyEmailPage from '@/pages/VerifyEmailPage.vue';
import { getToken, setToken } from '@/api/http.ts';
import { useAuthStore } from '@/stores/auth.ts';
import { mockFetch } from './fetchMock.ts';

const Stub = defineComponent(() => () => h('div'));
const mounted: { unmount(): void }[] = [];

async function mountAt(path: string, component: typeof RegisterPage) {
  const pinia = createPinia();
  setActivePinia(pinia);
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/register', name: 'register', component: RegisterPage },
      { path: '/verify-email', name: 'verify-email', component: VerifyEmailPage },
      { path: '/sign-in', name: 'sign-in', component: Stub },
      { path: '/buildings', name: 'buildings', component: Stub },
    ],
  });
  await router.push(path);
  await router.isReady();
  const wrapper = mount(component, { global: { plugins: [pinia, router] } });
  mounted.push(wrapper);
  return { wrapper, router };
}

describe('account pages', () => {
  beforeEach(() => localStorage.clear());
  afterEach(() => {
    for (const w of mounted.splice(0)) w.unmount();
    vi.useRealTimers();
    vi.unstubAllGlobals();
  });

  it('registers without starting a session and says where the link went', async () => {
    const requests = mockFetch({
      'POST /api/auth/register': () => ({
        status: 202,
        body: { status: 'verification-sent', email: 'ana@example.test' },
      }),
    });
    const { wrapper, router } = await mountAt('/register', RegisterPage);
    await wrapper.find('input[data-test="name"]').setValue('Ana Example');
    await wrapper.find('input[data-test="email"]').setValue('Ana@Example.test');
    await wrapper.find('input[data-test="password"]').setValue('quiet ferry lantern orbit');
    await wrapper.find('form').trigger('submit');
    await flushPromises();
    expect(requests.filter((r) => r.url === '/api/auth/register').map((r) => r.body)).toEqual([
      { name: 'Ana Example', email: 'ana@example.test', password: 'quiet ferry lantern orbit' },
    ]);
    expect(wrapper.find('[data-test="sent"]').text()).toContain('ana@example.test');
    expect(getToken()).toBeNull();
    expect(router.currentRoute.value.name).toBe('register');
  });

  it("shows the server's rating of the password as it is typed", async () => {
    vi.useFakeTimers();
    const requests = mockFetch({
      'POST /api/auth/password-strength': () => ({
        status: 200,
        body: { score: 1, required: 3, acceptable: false, warning: 'This is a very common password.', suggestions: [] },
      }),
    });
    const { wrapper } = await mountAt('/register', RegisterPage);
    await wrapper.find('input[data-test="password"]').setValue('password1234');
    await vi.advanceTimersByTimeAsync(500);
    await flushPromises();
    expect(requests.map((r) => r.url)).toEqual(['/api/auth/password-strength']);
    expect(wrapper.find('[data-test="strength"]').text()).toContain(
      'Too easy to guess: This is a very common password.',
    );
  });

  it('follows the verification link and says the address is confirmed', async () => {
    const requests = mockFetch({
      'POST /api/auth/verify': () => ({
        status: 200,
        body: { id: 3, email: 'ana@example.test', name: 'Ana', isAdmin: false, emailVerified: true },
      }),
    });
    const { wrapper } = await mountAt('/verify-email?token=abc.def.ghi', VerifyEmailPage);
    await vi.waitFor(async () => {
      await flushPromises();
      expect(wrapper.find('[data-test="verified"]').exists()).toBe(true);
    });
    expect(requests.filter((r) => r.url === '/api/auth/verify').map((r) => r.body)).toEqual([{ token: 'abc.def.ghi' }]);
    expect(wrapper.find('[data-test="verified"]').text()).toContain('ana@example.test');
  });

  it("shows the server's refusal of an old link", async () => {
    mockFetch({
      'POST /api/auth/verify': () => ({
        status: 422,
        body: { error: { code: 'unprocessable', message: 'This verification link has expired' } },
      }),
    });
    const { wrapper } = await mountAt('/verify-email?token=old', VerifyEmailPage);
    await vi.waitFor(async () => {
      await flushPromises();
      expect(wrapper.find('[data-test="failure"]').exists()).toBe(true);
    });
    expect(wrapper.find('[data-test="failure"]').text()).toContain('expired');
  });

  it('signs out through the server, then forgets the session', async () => {
    setToken('tok-1');
    const requests = mockFetch({ 'POST /api/auth/logout': () => ({ status: 204 }) });
    setActivePinia(createPinia());
    const auth = useAuthStore();
    await auth.signOut();
    expect(requests.map((r) => [r.method, r.url, r.authorization])).toEqual([
      ['POST', '/api/auth/logout', 'Bearer tok-1'],
    ]);
    expect(getToken()).toBeNull();
    expect(auth.isSignedIn).toBe(false);
  });
});
