import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory, createRouter } from 'vue-router';
import { defineComponent, h } from 'vue';
import { QLayout, QPageContainer } from 'quasar';
import BuildingsPage from '@/pages/BuildingsPage.vue';
import { mockFetch } from './fetchMock.ts';

const Stub = defineComponent(() => () => h('div'));

async function mountPage() {
  const pinia = createPinia();
  setActivePinia(pinia);
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/buildings', name: 'buildings', component: BuildingsPage },
      { path: '/buildings/:id', name: 'building', component: Stub },
    ],
  });
  await router.push('/buildings');
  // QPage must sit inside a QLayout; a minimal host gives it one.
  const Host = defineComponent(() => () => h(QLayout, null, () => h(QPageContainer, null, () => h(BuildingsPage))));
  const wrapper = mount(Host, { global: { plugins: [pinia, router] } });
  await flushPromises();
  return wrapper;
}

describe('buildings page', () => {
  beforeEach(() => localStorage.clear());
  afterEach(() => vi.unstubAllGlobals());

  it('shows an empty state with a way to create the first building', async () => {
    mockFetch({ 'GET /api/buildings': () => ({ status: 200, body: [] }) });
    const wrapper = await mountPage();
    expect(wrapper.text()).toContain('No buildings yet');
    expect(wrapper.findAll('button').some((b) => b.text().includes('New building'))).toBe(true);
  });

  it("shows the server's error with a way to try again, and recovers", async () => {
    let fail = true;
    const requests = mockFetch({
      'GET /api/buildings': () =>
        fail
          ? { status: 500, body: { error: { code: 'internal', message: 'The database is not answering' } } }
          : {
              status: 200,
              body: [
                {
                  id: 1,
                  name: 'Demo block',
                  reference: 'D-1',
                  role: 'lead',
                  stackCount: 2,
                  worstUtilisation: 0.7,
                  updatedAt: '2026-03-14T09:05:00Z',
                },
              ],
            },
    });
    const wrapper = await mountPage();
    expect(wrapper.find('[role="alert"]').text()).toContain('The database is not answering');
    fail = false;
    await wrapper
      .findAll('button')
      .find((b) => b.text().includes('Try again'))!
      .trigger('click');
    await flushPromises();
    expect(requests).toHaveLength(2);
    expect(wrapper.find('[role="alert"]').exists()).toBe(false);
    expect(wrapper.text()).toContain('Demo block');
    expect(wrapper.text()).toContain('2026-03-14 09:05');
  });
});
