// The build-ups editor: what it sends is each card's own build-up, partitions included, after cards are
// removed and added (docs/building-model.md §Floor loads). Invented demo build-ups.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import type { Buildup } from '@shared/schema/building.ts';
import BuildupsEditor from '@/components/building/BuildupsEditor.vue';
import { useBuildingModelStore } from '@/stores/buildingModel.ts';
import { mockFetch } from './fetchMock.ts';

const withPartitions: Buildup = {
  id: 'office',
  name: 'Office',
  permanent: [{ label: 'Slab', gk: 4 }],
  imposed: { qk: 2.5, category: 'B' },
  partitions: { load: 1.2, as: 'imposed' },
};
const plantRoom: Buildup = {
  id: 'plant',
  name: 'Plant',
  permanent: [{ label: 'Slab', gk: 5 }],
  imposed: { qk: 7.5, category: 'E' },
};

function mountEditor(buildups: Buildup[]) {
  const pinia = createPinia();
  setActivePinia(pinia);
  useBuildingModelStore().buildingId = 7;
  const sent: unknown[] = [];
  mockFetch({
    'PUT /api/buildings/7/buildups': (req) => {
      sent.push(req.body);
      const body = req.body as { buildups: Buildup[] };
      return {
        status: 200,
        body: { grid: { x: { lines: [] }, y: { lines: [] } }, floors: [], overrides: {}, ...body, version: 2 },
      };
    },
  });
  const wrapper = mount(BuildupsEditor, { props: { buildups, canEdit: true }, global: { plugins: [pinia] } });
  return { wrapper, sent };
}

describe('build-ups editor', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('keeps each build-up its own partitions when one before it is removed', async () => {
    const { wrapper, sent } = mountEditor([withPartitions, plantRoom]);
    await wrapper.find('button[aria-label="Remove Office"]').trigger('click');
    await wrapper.find('[data-test="buildups-save"]').trigger('click');
    await flushPromises();
    // The plant room had no partitions and still has none: the office's 1.2 kN/m² went with the office.
    expect(sent).toEqual([{ buildups: [plantRoom] }]);
  });

  it('sends a new build-up with no partitions and the others as they were', async () => {
    const { wrapper, sent } = mountEditor([withPartitions]);
    await wrapper.find('[data-test="buildup-add"]').trigger('click');
    await wrapper.find('[data-test="buildups-save"]').trigger('click');
    await flushPromises();
    const { buildups } = sent[0] as { buildups: Buildup[] };
    expect(buildups[0]).toEqual(withPartitions);
    expect(buildups[1]).not.toHaveProperty('partitions');
    expect(buildups).toHaveLength(2);
  });
});
