// The results pane with buckling lengths from the critical buckling analysis: the working shows the
// tabulated factors beside the analysed ones and a plot of the stack's buckled shape (invented stack).
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { analyseStack } from '@shared/engine/index.ts';
import type { StackDocument } from '@shared/schema/stack.ts';
import ResultsPanel from '@/components/stack/ResultsPanel.vue';
import { shapeGeometry } from '@/components/stack/bucklingShapePath.ts';

const floor = (id: string, elevation: number) => ({
  id,
  kind: 'restraint' as const,
  data: { elevation, axes: 'both' as const, fixity: 'pinned' as const, Gk: 260, Qk: 110, category: 'B' as const },
});
const doc: StackDocument = {
  nodes: [
    { id: 'sup', kind: 'support', data: { elevation: 0, fixity: 'fixed' } },
    { id: 'l1', kind: 'lift', data: { section: 'UKC 203x203x60', grade: 'S355' } },
    { id: 'sp', kind: 'splice', data: { elevation: 8 } },
    { id: 'l2', kind: 'lift', data: { section: 'UKC 152x152x30', grade: 'S355' } },
    { id: 'cap', kind: 'cap', data: { elevation: 12, fixity: 'pinned', Gk: 150, Qk: 40, category: 'H' } },
    floor('r4', 4),
    floor('r8', 8),
  ],
  edges: [
    { id: 'e1', source: 'sup', target: 'l1' },
    { id: 'e2', source: 'l1', target: 'sp' },
    { id: 'e3', source: 'sp', target: 'l2' },
    { id: 'e4', source: 'l2', target: 'cap' },
    { id: 'e5', source: 'r4', target: 'l1' },
    { id: 'e6', source: 'r8', target: 'l1' },
  ],
};
const critical = analyseStack(doc, { bucklingLengths: 'critical' });
const tabulated = analyseStack(doc);

describe('buckled shape in the results pane', () => {
  it('shows the buckled shape with αcr per axis and the tabulated factors for the selected lift', () => {
    expect(critical.errors).toEqual([]);
    const w = mount(ResultsPanel, { props: { results: critical, doc, selectedLiftId: 'l1', stale: false } });
    const plot = w.find('[data-test="buckled-shape"]');
    expect(plot.exists()).toBe(true);
    expect(plot.findAll('polyline.shape-plot__mode')).toHaveLength(2);
    expect(plot.text()).toContain(`y-y: αcr = ${critical.criticalBuckling?.y.alphaCr.toFixed(2)}`);
    expect(w.find('[data-test="tabulated-k"]').text()).toMatch(/0\.85 \/ 0\.85/);
  });

  it('shows neither with tabulated factors', () => {
    const w = mount(ResultsPanel, { props: { results: tabulated, doc, selectedLiftId: 'l1', stale: false } });
    expect(w.find('[data-test="buckled-shape"]').exists()).toBe(false);
    expect(w.find('[data-test="tabulated-k"]').exists()).toBe(false);
  });

  it('draws the mode to scale: held points on the column line, the largest displacement at the box edge', () => {
    const axis = { alphaCr: 2, shape: { elevations: [0, 2, 4], displacements: [0, 1, 0] } };
    const g = shapeGeometry(axis, { x: 0, y: 0, width: 100, height: 200 });
    expect(g?.points).toBe('50.0,200.0 96.0,100.0 50.0,0.0');
    expect(g?.held).toEqual([200, 0]);
  });
});
