// A restraint of a stack on the grid says where its loads come from: the floor (fields locked, the floor's
// figures shown) or set by hand (the floor's figures beside them), and switches between the two.
import { afterEach, describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import type { FloorLoadUse, StackResult } from '@shared/schema/results.ts';
import type { StackDocument } from '@shared/schema/stack.ts';
import PropertiesPanel from '@/components/stack/PropertiesPanel.vue';

const doc = (loadsByHand?: boolean): StackDocument => ({
  nodes: [
    {
      id: 'r1',
      kind: 'restraint',
      data: {
        elevation: 4,
        levelId: '2',
        axes: 'both',
        fixity: 'pinned',
        Gk: 0,
        Qk: 0,
        category: 'A',
        ...(loadsByHand ? { loadsByHand } : {}),
      },
    },
  ],
  edges: [],
});
const use = (byHand: boolean): FloorLoadUse => ({
  nodeId: 'r1',
  levelId: '2',
  area: 25.3125,
  gridArea: 25.3125,
  Gk: 126.5625,
  Qk: 63.28125,
  category: 'B',
  faces: { yPlus: { Gk: 60, Qk: 30 } },
  lineGk: 0,
  lineQk: 0,
  byHand,
});
const results = (byHand: boolean): StackResult => ({
  errors: [],
  warnings: [],
  lifts: [],
  governingLiftId: null,
  takeDown: [],
  floorLoads: [use(byHand)],
});

afterEach(() => {
  document.body.innerHTML = '';
});

function mountPanel(byHand: boolean) {
  setActivePinia(createPinia());
  return mount(PropertiesPanel, {
    props: { doc: doc(byHand), selection: ['r1'], results: results(byHand), readOnly: false },
    attachTo: document.body,
  });
}

describe('loads of a restraint on a floor with floor loads', () => {
  it("shows the floor's loads in locked fields and offers to set them by hand with those figures", async () => {
    const w = mountPanel(false);
    expect(w.get('[data-test="floor-load-note"]').text()).toContain('Loads from the floor of this level');
    const gk = w.get('input[data-field="Gk"]');
    expect((gk.element as HTMLInputElement).value).toBe('126.563');
    expect(gk.attributes('readonly')).toBeDefined();
    await w.get('[data-test="set-loads-by-hand"]').trigger('click');
    const [ops] = w.emitted('edit')![0] as unknown as [{ op: string; data: Record<string, unknown> }[]];
    expect(ops[0].data).toMatchObject({
      loadsByHand: true,
      Gk: 126.5625,
      Qk: 63.28125,
      category: 'B',
      faces: { yPlus: { Gk: 60, Qk: 30 } },
    });
    w.unmount();
  });

  it("marks loads set by hand, keeps the fields open and offers the floor's loads back", async () => {
    const w = mountPanel(true);
    const note = w.get('[data-test="floor-load-note"]');
    expect(note.attributes('data-by-hand')).toBe('true');
    expect(note.text()).toContain('Loads set by hand');
    expect(w.get('input[data-field="Gk"]').attributes('readonly')).toBeUndefined();
    await w.get('[data-test="use-floor-loads"]').trigger('click');
    const [ops] = w.emitted('edit')![0] as unknown as [{ op: string; data: Record<string, unknown> }[]];
    expect(ops[0].data).toEqual({ loadsByHand: false });
    w.unmount();
  });
});
