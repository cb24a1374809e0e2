// The dialog of a stack's positions (docs/typical-columns.md) reads the areas set by hand again when the stack comes
// back re-analysed while it is open, as a colleague's change of areas brings it, but not while this person is
// editing areas (their draft stays theirs). Figures invented.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { EMPTY_GRID } from '@shared/schema/building.ts';
import StackPositionsButton from '@/components/stack/positions/StackPositionsButton.vue';
import { useStackStore } from '@/stores/stack.ts';
import { mockFetch, type RecordedRequest } from './fetchMock.ts';

let requests: RecordedRequest[];
/** How many areas the building model holds for the stack's own place: one more at each read. */
let served = 0;

beforeEach(() => {
  const pinia = createPinia();
  setActivePinia(pinia);
  served = 0;
  requests = mockFetch({
    'GET /api/buildings/9/model': () => {
      served += 1;
      const overrides = Array.from({ length: served }, (_, i) => ({
        levelId: String(i + 2),
        factor: 0.5,
        reason: 'Stair void',
      }));
      return {
        status: 200,
        body: { grid: EMPTY_GRID, buildups: [], floors: [], overrides: { 1: overrides }, version: served },
      };
    },
    'GET /api/stacks/1/positions': () => ({
      status: 200,
      body: { stackId: 1, version: 3, positions: [], results: [], governingPosition: null },
    }),
  });
  useStackStore().$patch({ stackId: 1, buildingId: 9, gridX: 'A', version: 3 });
});
afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const reads = () => requests.filter((r) => r.method === 'GET').map((r) => r.url);
const byTest = (name: string) => document.body.querySelector<HTMLElement>(`[data-test="${name}"]`);

describe('the positions dialog', () => {
  it('reads the areas again when the stack comes back re-analysed, unless areas are being edited', async () => {
    const wrapper = mount(StackPositionsButton, { props: { stackId: 1, buildingId: 9 }, attachTo: document.body });
    await wrapper.find('[data-test="open-positions"]').trigger('click');
    await flushPromises();
    expect(byTest('own-overrides')?.textContent).toContain('area set by hand at 1 level');

    const stack = useStackStore();
    stack.$patch({ version: 4 });
    await flushPromises();
    expect(byTest('own-overrides')?.textContent).toContain('area set by hand at 2 levels');
    expect(reads()).toEqual([
      '/api/buildings/9/model',
      '/api/stacks/1/positions',
      '/api/buildings/9/model',
      '/api/stacks/1/positions',
    ]);

    byTest('position-areas-own')?.click();
    await flushPromises();
    stack.$patch({ version: 5 });
    await flushPromises();
    expect(reads()).toHaveLength(4);
    wrapper.unmount();
  });
});
