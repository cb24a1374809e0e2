import { describe, expect, it } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import type { Building, StackSummary } from '@shared/schema/api.ts';
import { DEFAULT_ANALYSIS_OPTIONS } from '@shared/schema/results.ts';
import StacksTable from '@/components/building/StacksTable.vue';
import { useBuildingModelStore } from '@/stores/buildingModel.ts';
import { useBuildingsStore } from '@/stores/buildings.ts';
import { useStackPositionsStore } from '@/stores/stackPositions.ts';

// Invented demo stacks. The colour bands (≤ 0.85 comfortable, ≤ 1.00 close, > 1.00 over) are our own
// scale: common practice, no source.
const base = { buildingId: 7, version: 3, updatedAt: '2026-03-14T09:05:00.000Z' };
const stacks: StackSummary[] = [
  {
    ...base,
    id: 1,
    name: 'A/1',
    liftCount: 2,
    governingLiftId: 'n-a1',
    governingLiftLabel: 'L1',
    governingSection: 'UKC 254x254x89',
    utilisation: 0.62,
    status: 'passes',
  },
  {
    ...base,
    id: 2,
    name: 'B/2',
    liftCount: 3,
    governingLiftId: 'n-b2',
    governingLiftLabel: 'L2',
    governingSection: 'UKC 203x203x46',
    utilisation: 0.92,
    status: 'passes',
  },
  {
    ...base,
    id: 3,
    name: 'C/3',
    liftCount: 2,
    governingLiftId: 'n-c1',
    governingLiftLabel: 'L1',
    governingSection: 'HE 200 A',
    utilisation: 1.14,
    status: 'fails',
  },
  {
    ...base,
    id: 4,
    name: 'D/4',
    liftCount: 1,
    governingLiftId: null,
    governingLiftLabel: null,
    governingSection: null,
    utilisation: null,
    status: 'errors',
  },
];

// Invented demo building holding them.
const building: Building = {
  id: 7,
  name: 'Demo office block',
  reference: 'D-001',
  role: 'viewer',
  stackCount: stacks.length,
  worstUtilisation: 1.14,
  updatedAt: '2026-03-14T09:05:00.000Z',
  options: DEFAULT_ANALYSIS_OPTIONS,
};

/** The table as the building page shows it: the open building's stacks and this person's role, from the store. */
function mountTable(role: Building['role'] = 'viewer', shown: StackSummary[] = stacks) {
  const pinia = createPinia();
  setActivePinia(pinia);
  const store = useBuildingsStore();
  store.current = { ...building, role };
  store.stacks = shown;
  return mount(StacksTable, { global: { plugins: [pinia] } });
}

function rowOf(wrapper: ReturnType<typeof mount>, name: string) {
  const row = wrapper.findAll('tbody tr').find((r) => r.find('[data-test="name"]').text() === name);
  if (!row) throw new Error(`No row for ${name}`);
  return row;
}

/** QLinearProgress draws its fill with transform: scale3d(value, 1, 1). */
function barFill(row: ReturnType<typeof rowOf>): string {
  const style = row.find('.q-linear-progress__model').attributes('style') ?? '';
  return style.match(/scale3d\(([^,]+),/)?.[1] ?? 'none';
}

describe('stacks table', () => {
  it('shows utilisation as a number to two places and a bar in its colour band', () => {
    const wrapper = mountTable('viewer');
    const comfortable = rowOf(wrapper, 'A/1').find('[data-test="utilisation"]');
    expect(comfortable.text()).toBe('0.62');
    expect(comfortable.find('[data-band]').attributes('data-band')).toBe('ok');
    expect(barFill(rowOf(wrapper, 'A/1'))).toBe('0.62');

    expect(rowOf(wrapper, 'B/2').find('[data-band]').attributes('data-band')).toBe('near');
    expect(rowOf(wrapper, 'B/2').find('.q-linear-progress').classes().join(' ')).toContain('text-warning');
  });

  it('caps the bar at full length for a failing stack but prints the real utilisation', () => {
    const wrapper = mountTable('viewer');
    const row = rowOf(wrapper, 'C/3');
    expect(row.find('[data-test="utilisation"]').text()).toBe('1.14');
    expect(row.find('[data-band]').attributes('data-band')).toBe('over');
    expect(barFill(row)).toBe('1');
    expect(row.find('[data-test="status"]').text()).toContain('Fails');
  });

  it("names the governing lift by its label and section (never the graph's internal node id), and the status of each stack", () => {
    const wrapper = mountTable('viewer');
    const governing = rowOf(wrapper, 'B/2').find('[data-test="governing"]');
    expect(governing.text().replace(/\s+/g, ' ')).toBe('L2 · UKC 203x203x46');
    expect(governing.text()).not.toContain('n-b2');
    expect(rowOf(wrapper, 'A/1').find('[data-test="status"]').text()).toContain('Passes');
  });

  it('shows a stack with errors as such, with no utilisation and no bar', () => {
    const wrapper = mountTable('viewer');
    const row = rowOf(wrapper, 'D/4');
    expect(row.find('[data-test="status"]').text()).toContain('Has errors');
    expect(row.find('[data-test="utilisation"]').text()).toBe('—');
    expect(row.find('.q-linear-progress').exists()).toBe(false);
    expect(row.find('[data-test="governing"]').text()).toBe('—');
  });

  it('offers rename to engineers and delete to the lead only, and neither to a viewer', () => {
    const viewer = mountTable('viewer');
    expect(viewer.find('[data-test="rename"]').exists()).toBe(false);
    expect(viewer.find('[data-test="delete"]').exists()).toBe(false);
    const engineer = mountTable('engineer');
    expect(engineer.findAll('[data-test="rename"]')).toHaveLength(stacks.length);
    expect(engineer.find('[data-test="delete"]').exists()).toBe(false);
    const lead = mountTable('lead');
    expect(lead.findAll('[data-test="delete"]')).toHaveLength(stacks.length);
  });

  it('lists grid references in natural order', () => {
    const mixed = [10, 2, 1].map((n, i) => ({ ...stacks[0], id: 10 + i, name: `C/${n}` }));
    const wrapper = mountTable('viewer', mixed);
    expect(wrapper.findAll('[data-test="name"]').map((c) => c.text())).toEqual(['C/1', 'C/2', 'C/10']);
  });

  it('opens a stack when its row is clicked, and draws its rows as clickable', async () => {
    const wrapper = mountTable('viewer');
    expect(rowOf(wrapper, 'B/2').classes()).toContain('cursor-pointer');
    await rowOf(wrapper, 'B/2').find('[data-test="governing"]').trigger('click');
    expect(wrapper.emitted('open')).toEqual([[2]]);
  });

  it('says where each stack stands: off the grid, at its crossing, or at every position of a typical column', async () => {
    // Invented grid: lines with ids unlike their names, so a crossing must be named from the grid.
    const placed = [
      // Named A/1 but standing at A/2: the cell names the crossing, not the stack.
      { ...stacks[0], gridX: 'gx-a', gridY: 'gy-2', webAlong: 'x' as const },
      { ...stacks[1], gridX: 'gx-b', gridY: 'gy-2', webAlong: 'x' as const },
      stacks[2],
    ];
    const wrapper = mountTable('viewer', placed);
    // Lines `prefix-name` at even spacing: ids unlike the names people read.
    const family = (prefix: string, names: string[], spacing: number) => ({
      lines: names.map((name, n) => ({ id: `${prefix}-${name.toLowerCase()}`, name, position: n * spacing })),
      edgeBefore: 0,
      edgeAfter: 0,
    });
    useBuildingModelStore().model.grid = { x: family('gx', ['A', 'B'], 7.5), y: family('gy', ['1', '2'], 6) };
    // B/2 is a typical column also standing at B/1, which governs it.
    const at = (name: string, gridX: string, gridY: string, positionId: number | null) => ({
      positionId,
      gridX,
      gridY,
      name,
      area: 20,
      utilisation: 0.9,
      status: 'passes' as const,
      governingLiftId: null,
      governingLiftLabel: null,
      governingSection: null,
      lifts: [],
      errors: [],
    });
    useStackPositionsStore().byStack = new Map([
      [2, { results: [at('B/2', 'gx-b', 'gy-2', null), at('B/1', 'gx-b', 'gy-1', 5)], governingPosition: 'B/1' }],
    ]);
    await wrapper.vm.$nextTick();
    const cell = (name: string) => rowOf(wrapper, name).find('[data-test="stands-at"]');
    expect(cell('A/1').text()).toBe('A/2');
    expect(cell('B/2').text().replace(/\s+/g, ' ')).toBe('B/2, B/1');
    expect(cell('B/2').find('.text-weight-bold').text()).toBe('B/1');
    expect(cell('C/3').text()).toBe('off the grid');
  });

  it('asks before deleting a stack, naming it', async () => {
    const lead = mountTable('lead');
    await rowOf(lead, 'C/3').find('[data-test="delete"]').trigger('click');
    await flushPromises();
    expect(document.body.textContent).toContain('Delete stack C/3 and its results? Frozen revisions keep their copy.');
    lead.unmount();
  });
});
