// A page that could not be loaded: a failure that may pass (the server unreachable) offers to try again;
// a building or stack that does not exist or is not shared (404) offers the way back to the buildings
// list instead, since asking again gives the same answer.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory, createRouter } from 'vue-router';
import { defineComponent, h } from 'vue';
import LoadState from '@/components/common/LoadState.vue';
import { useBuildingsStore } from '@/stores/buildings.ts';
import { mockFetch } from './fetchMock.ts';

const Stub = defineComponent(() => () => h('div'));

async function mountState(props: Record<string, unknown>) {
  const router = createRouter({
    history: createMemoryHistory(),
    routes: [{ path: '/buildings', name: 'buildings', component: Stub }],
  });
  await router.push('/buildings');
  return mount(LoadState, { props: { state: 'error', ...props }, global: { plugins: [router] } });
}

afterEach(() => vi.unstubAllGlobals());

describe('load state', () => {
  it('offers to try again after a failure that may pass', async () => {
    const w = await mountState({ error: 'Cannot reach the server' });
    expect(w.text()).toContain('Try again');
    expect(w.find('[data-test="go-to-buildings"]').exists()).toBe(false);
  });

  it('offers the buildings list, not another try, for something that is not there', async () => {
    const w = await mountState({ error: 'Building not found', missing: true });
    expect(w.text()).not.toContain('Try again');
    expect(w.find('[data-test="go-to-buildings"]').attributes('href')).toBe('/buildings');
  });
});

describe('opening a building', () => {
  it('marks a 404 as missing and an unreachable server as not', async () => {
    setActivePinia(createPinia());
    const store = useBuildingsStore();
    mockFetch({});
    await store.open(999);
    expect(store.opened.state).toBe('error');
    expect(store.opened.missing).toBe(true);

    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    await store.open(998);
    await flushPromises();
    expect(store.opened.state).toBe('error');
    expect(store.opened.missing).toBe(false);
  });
});
