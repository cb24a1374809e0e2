// The node components, drawn by Vue Flow from a document through the mapping composable.
import { describe, expect, it } from 'vitest';
import { defineComponent, h, nextTick } from 'vue';
import { mount, flushPromises } from '@vue/test-utils';
import { VueFlow } from '@vue-flow/core';
import type { StackResult } from '@shared/schema/results.ts';
import type { StackDocument } from '@shared/schema/stack.ts';
import { nodeTypes } from '@/components/graph/nodes/index.ts';
import { useStackGraph } from '@/composables/useStackGraph.ts';
import StackGraph from '@/components/graph/StackGraph.vue';

// Invented demo stack: one lift from a pinned base at ±0 to a cap at +4, a restraint at +4 is not needed.
const doc: StackDocument = {
  nodes: [
    { id: 'sup', kind: 'support', data: { elevation: 0, fixity: 'pinned' } },
    { id: 'l1', kind: 'lift', data: { section: 'UKC 203x203x46', grade: 'S355', kY: 0.85, note: 'base detail' } },
    {
      id: 'r1',
      kind: 'restraint',
      data: { elevation: 2, axes: 'z', fixity: 'pinned', Gk: 120, Qk: 45.5, category: 'B' },
    },
    { id: 'cap', kind: 'cap', data: { elevation: 4, fixity: 'pinned', Gk: 80, Qk: 20, category: 'H' } },
    { id: 'ld', kind: 'load', data: { label: 'Plant', Gk: 15, Qk: 5, category: 'E' } },
  ],
  edges: [
    { id: 'e1', source: 'sup', target: 'l1' },
    { id: 'e2', source: 'l1', target: 'cap' },
    { id: 'e3', source: 'r1', target: 'l1' },
    { id: 'e4', source: 'ld', target: 'cap' },
  ],
};

function mountGraph(results: StackResult | null, others: { userId: number; name: string; selection: string[] }[] = []) {
  const Host = defineComponent({
    setup() {
      const { nodes, edges } = useStackGraph({ doc, results, selection: ['r1'], others, readOnly: false });
      return () =>
        h('div', { style: 'width: 800px; height: 600px' }, [
          h(VueFlow, { nodes: nodes.value, edges: edges.value, nodeTypes }),
        ]);
    },
  });
  return mount(Host, { attachTo: document.body });
}

const node = (w: ReturnType<typeof mountGraph>, id: string) => w.find(`[data-id="${id}"]`);

describe('graph node components', () => {
  it('draw each kind with its key values and units', async () => {
    const w = mountGraph(null);
    await flushPromises();
    await nextTick();
    expect(node(w, 'sup').text()).toContain('+0.000 m');
    expect(node(w, 'sup').text()).toContain('pinned base');
    expect(node(w, 'l1').text()).toContain('UKC 203x203x46 · S355');
    expect(node(w, 'l1').text()).toContain('+0.000 to +4.000 m (4.00 m)');
    expect(node(w, 'l1').text()).toContain('ky = 0.85');
    expect(node(w, 'r1').text()).toContain('z-z only');
    expect(node(w, 'r1').text()).toContain('Gk 120 kN · Qk 45.5 kN (B)');
    expect(node(w, 'cap').text()).toContain('Cap +4.000');
    expect(node(w, 'ld').text()).toContain('Load "Plant"');
    expect(node(w, 'ld').text()).toContain('Qk 5 kN (E)');
    w.unmount();
  });

  it('marks validation problems on their node and the governing lift with its utilisation', async () => {
    const results: StackResult = {
      errors: [{ nodeId: 'r1', message: 'Restraint at +2.000 is outside the lift it is attached to' }],
      warnings: [],
      lifts: [
        {
          liftId: 'l1',
          bottom: 0,
          top: 4,
          section: 'UKC 203x203x46',
          grade: 'S355',
          utilisation: 0.91,
          governing: 'flexural-z',
          pieces: [],
        },
      ],
      governingLiftId: 'l1',
      takeDown: [],
    };
    const w = mountGraph(results);
    await flushPromises();
    expect(node(w, 'r1').find('.node-card--error').exists()).toBe(true);
    expect(node(w, 'r1').find('[aria-label]').attributes('aria-label')).toContain('outside the lift');
    expect(node(w, 'sup').find('.node-card--error').exists()).toBe(false);
    expect(node(w, 'l1').find('.node-card--governing').exists()).toBe(true);
    expect(node(w, 'l1').text()).toContain('governs');
    // 0.91 is between 0.85 and 1.00: the amber band of the legend
    expect(node(w, 'l1').find('[data-band]').attributes('data-band')).toBe('near');
    w.unmount();
  });

  it('shows who else has a node selected and outlines the selected node', async () => {
    const w = mountGraph(null, [{ userId: 7, name: 'Ana Example', selection: ['cap'] }]);
    await flushPromises();
    expect(node(w, 'cap').find('.node-card__person').text()).toBe('AE');
    expect(node(w, 'l1').find('.node-card__person').exists()).toBe(false);
    expect(node(w, 'r1').find('.node-card--selected').exists()).toBe(true);
    w.unmount();
  });
});

describe('stack graph', () => {
  it('draws every edge of the document although its connection rules refuse a second one like it', async () => {
    const w = mount(StackGraph, {
      props: { doc, results: null, selection: [], others: [], readOnly: false },
      attachTo: document.body,
    });
    await flushPromises();
    // new results make Vue Flow take the edges again, now with the connection rules in force
    await w.setProps({ results: { errors: [], warnings: [], lifts: [], governingLiftId: null, takeDown: [] } });
    await flushPromises();
    expect(w.findAll('.vue-flow__edge')).toHaveLength(doc.edges.length);
    expect(w.find('.node-palette').exists()).toBe(true);
    w.unmount();
  });

  it('names the zoom and fit buttons, which the graph library draws as bare icons', async () => {
    const w = mount(StackGraph, {
      props: { doc, results: null, selection: [], others: [], readOnly: true },
      attachTo: document.body,
    });
    await flushPromises();
    const names = w.findAll('.vue-flow__controls-button').map((b) => b.text());
    expect(names.map((n) => n.replace(/^(add|remove|fit_screen)/, ''))).toEqual([
      'Zoom in',
      'Zoom out',
      'Show the whole stack',
    ]);
    w.unmount();
  });

  it('gives a viewer no palette', async () => {
    const w = mount(StackGraph, {
      props: { doc, results: null, selection: [], others: [], readOnly: true },
      attachTo: document.body,
    });
    await flushPromises();
    expect(w.find('.node-palette').exists()).toBe(false);
    w.unmount();
  });
});
