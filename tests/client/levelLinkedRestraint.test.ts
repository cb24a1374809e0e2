// A restraint, cap or support on a level takes its elevation from the level, so its properties form must not offer an
// elevation that the analysis would ignore; untying it from the level makes the elevation its own again.
import { afterEach, describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import type { Op } from '@shared/schema/ops.ts';
import type { StackDocument } from '@shared/schema/stack.ts';
import PropertiesPanel from '@/components/stack/PropertiesPanel.vue';

// Invented demo values.
const onLevel = {
  elevation: 3.8,
  levelId: '2',
  axes: 'both',
  fixity: 'pinned',
  Gk: 160,
  Qk: 80,
  category: 'B',
} as const;
const doc = (data: Record<string, unknown>): StackDocument => ({
  nodes: [
    { id: 'l1', kind: 'lift', data: { section: 'UKC 203x203x46', grade: 'S355' } },
    { id: 'r1', kind: 'restraint', data: data as never },
  ],
  edges: [{ id: 'e1', source: 'r1', target: 'l1' }],
});

const elevationInput = (w: ReturnType<typeof mount>) => w.find('input[data-field="elevation"]');

afterEach(() => {
  document.body.innerHTML = '';
});

describe('a restraint tied to a level', () => {
  it('shows its elevation read-only, saying that the level sets it', () => {
    const w = mount(PropertiesPanel, {
      props: { doc: doc(onLevel), selection: ['r1'], results: null, readOnly: false },
    });
    expect(elevationInput(w).attributes('readonly')).toBeDefined();
    expect(w.text()).toContain('Set by its level');
    expect(w.find('[data-test="untie-level"]').exists()).toBe(true);
  });

  it('keeps the elevation editable for a restraint on no level, with no untie button', () => {
    const { levelId: _level, ...own } = onLevel;
    const w = mount(PropertiesPanel, { props: { doc: doc(own), selection: ['r1'], results: null, readOnly: false } });
    expect(elevationInput(w).attributes('readonly')).toBeUndefined();
    expect(w.find('[data-test="untie-level"]').exists()).toBe(false);
  });

  it('unties it in one edit that keeps every other value and its edge to the lift', async () => {
    const w = mount(PropertiesPanel, {
      props: { doc: doc(onLevel), selection: ['r1'], results: null, readOnly: false },
    });
    await w.find('[data-test="untie-level"]').trigger('click');
    const [ops, label] = w.emitted('edit')?.[0] as [Op[], string];
    const added = ops.find((o) => o.op === 'addNode');
    expect(added && added.op === 'addNode' && added.node.data).toEqual({
      elevation: 3.8,
      axes: 'both',
      fixity: 'pinned',
      Gk: 160,
      Qk: 80,
      category: 'B',
    });
    expect(ops).toContainEqual({ op: 'addEdge', edge: { id: 'e1', source: 'r1', target: 'l1' } });
    expect(label).toBe('Untie Restraint +3.800 from its level');
  });

  it('offers no untie button to a viewer, nor advice to do what a viewer cannot', () => {
    const w = mount(PropertiesPanel, {
      props: { doc: doc(onLevel), selection: ['r1'], results: null, readOnly: true },
    });
    expect(w.find('[data-test="untie-level"]').exists()).toBe(false);
    expect(w.text()).toContain('Set by its level');
    expect(w.text()).not.toContain('untie it');
  });
});

describe('a cap and a support on levels', () => {
  const chain = (cap: Record<string, unknown>, support: Record<string, unknown>): StackDocument => ({
    nodes: [
      { id: 's', kind: 'support', data: support as never },
      { id: 'l1', kind: 'lift', data: { section: 'UKC 203x203x46', grade: 'S355' } },
      { id: 'c', kind: 'cap', data: cap as never },
    ],
    edges: [
      { id: 'e1', source: 's', target: 'l1' },
      { id: 'e2', source: 'l1', target: 'c' },
    ],
  });
  const cap = { elevation: 26.6, levelId: '9', fixity: 'pinned', Gk: 80, Qk: 35, category: 'H' };
  const support = { elevation: 0, levelId: '1', fixity: 'fixed' };

  it.each([
    ['cap', 'c'],
    ['support', 's'],
  ])('locks the %s elevation to its level and unties it in one edit', async (_kind, id) => {
    const w = mount(PropertiesPanel, {
      props: { doc: chain(cap, support), selection: [id], results: null, readOnly: false },
    });
    expect(elevationInput(w).attributes('readonly')).toBeDefined();
    expect(w.text()).toContain('Set by its level');
    await w.find('[data-test="untie-level"]').trigger('click');
    const [ops] = w.emitted('edit')?.[0] as [Op[], string];
    const added = ops.find((o) => o.op === 'addNode');
    expect(added && added.op === 'addNode' && 'levelId' in added.node.data).toBe(false);
  });
});
