import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { storeToRefs } from 'pinia';
import { defineComponent, h } from 'vue';
import type { Building, Level } from '@shared/schema/api.ts';
import { DEFAULT_ANALYSIS_OPTIONS } from '@shared/schema/results.ts';
import LevelsEditor from '@/components/building/LevelsEditor.vue';
import { useBuildingsStore } from '@/stores/buildings.ts';
import { useLevelsStore } from '@/stores/levels.ts';
import { mockFetch } from './fetchMock.ts';

// Invented demo building with two levels.
const building: Building = {
  id: 7,
  name: 'Demo office block',
  reference: 'D-001',
  role: 'engineer',
  stackCount: 0,
  worstUtilisation: null,
  updatedAt: '2026-03-14T09:05:00.000Z',
  options: DEFAULT_ANALYSIS_OPTIONS,
};
const levels: Level[] = [
  { id: 'lv-0', name: 'Ground floor', elevation: 0 },
  { id: 'lv-1', name: 'Level 1', elevation: 3.6 },
];

/** The editor as the building page uses it: levels and rights read from the store. */
function mountEditor(canEdit = true) {
  const pinia = createPinia();
  setActivePinia(pinia);
  const store = useBuildingsStore();
  store.current = { ...building, role: canEdit ? 'engineer' : 'viewer' };
  const levelsStore = useLevelsStore();
  levelsStore.replace(building.id, levels);
  const Host = defineComponent(() => {
    const { canEdit: editable } = storeToRefs(store);
    const { levels: current } = storeToRefs(levelsStore);
    return () => h(LevelsEditor, { levels: current.value, canEdit: editable.value });
  });
  return mount(Host, { global: { plugins: [pinia] } });
}

async function addLevel(wrapper: ReturnType<typeof mount>, name: string, elevation: string): Promise<void> {
  const forms = wrapper.findAll('form');
  const addForm = forms[forms.length - 1];
  await addForm.find('input[data-test="level-name"]').setValue(name);
  await addForm.find('input[data-test="level-elevation"]').setValue(elevation);
  await addForm.trigger('submit');
  await flushPromises();
}

describe('levels editor', () => {
  beforeEach(() => localStorage.clear());
  afterEach(() => vi.unstubAllGlobals());

  it('lists the levels from the top down with elevations to the millimetre', () => {
    const wrapper = mountEditor();
    const rows = wrapper.findAll('[data-test="level-row"]').map((r) => r.text());
    expect(rows[0]).toContain('Level 1');
    expect(rows[0]).toContain('+3.600 m');
    expect(rows[1]).toContain('+0.000 m');
  });

  it('refuses an elevation that is not a number, with a message, without calling the server', async () => {
    const requests = mockFetch({});
    const wrapper = mountEditor();
    await addLevel(wrapper, 'Level 2', 'seven');
    expect(wrapper.text()).toContain('Elevation must be a number');
    expect(requests).toHaveLength(0);
  });

  it('refuses an elevation beyond the −100 to +1000 m range of buildings the API accepts', async () => {
    const requests = mockFetch({});
    const wrapper = mountEditor();
    await addLevel(wrapper, 'Level 2', '1200');
    expect(wrapper.text()).toContain('Elevation must be at most 1000 m');
    expect(requests).toHaveLength(0);
  });

  it('refuses a second level at the same elevation', async () => {
    const requests = mockFetch({});
    const wrapper = mountEditor();
    await addLevel(wrapper, 'Mezzanine', '3.6');
    expect(wrapper.text()).toContain('Level "Level 1" is already at +3.600 m');
    expect(requests).toHaveLength(0);
  });

  it('refuses a second level of the same name, whatever its case, without calling the server', async () => {
    const requests = mockFetch({});
    const wrapper = mountEditor();
    await addLevel(wrapper, 'level 1 ', '7.2');
    expect(wrapper.find('[data-test="level-clash"]').text()).toBe(
      'There is already a level named "Level 1" (at +3.600 m)',
    );
    expect(requests).toHaveLength(0);
  });

  it('lets a level keep its own name and elevation when it is changed', async () => {
    const requests = mockFetch({
      // No stack uses the level: the move is saved without asking
      'POST /api/buildings/7/levels/lv-1/preview': () => ({ status: 200, body: { elevation: 3.65, stacks: [] } }),
      'PATCH /api/buildings/7/levels/lv-1': (req) => ({ status: 200, body: { id: 'lv-1', ...(req.body as object) } }),
    });
    const wrapper = mountEditor();
    await wrapper.find('[aria-label="Change Level 1"]').trigger('click');
    const form = wrapper.findAll('form')[0];
    await form.find('input[data-test="level-elevation"]').setValue('3.65');
    await form.trigger('submit');
    await flushPromises();
    expect(wrapper.find('[data-test="level-clash"]').exists()).toBe(false);
    expect(requests.map((r) => r.method)).toEqual(['POST', 'PATCH']);
  });

  it('adds a valid level through the API and shows it in elevation order', async () => {
    const requests = mockFetch({
      'POST /api/buildings/7/levels': (req) => ({ status: 201, body: { id: 'lv-2', ...(req.body as object) } }),
    });
    const wrapper = mountEditor();
    await addLevel(wrapper, 'Level 2', '7,2');
    expect(requests.map((r) => [r.method, r.url, r.body])).toEqual([
      ['POST', '/api/buildings/7/levels', { name: 'Level 2', elevation: 7.2 }],
    ]);
    const rows = wrapper.findAll('[data-test="level-row"]').map((r) => r.text());
    expect(rows[0]).toContain('Level 2');
    expect(rows[0]).toContain('+7.200 m');
  });

  it('hides the edit controls from a viewer', () => {
    const wrapper = mountEditor(false);
    expect(wrapper.find('form').exists()).toBe(false);
    expect(wrapper.find('button[aria-label^="Delete"]').exists()).toBe(false);
  });
});
